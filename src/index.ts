/**
 * Quiescent's model: the public face. Pure TypeScript, SI base units
 * (V, A, Ω, F, W, Hz), no DOM. Every solver answers `{ ok: true, … }` or a
 * typed failure `{ ok: false, reason, message }`; none throws or returns NaN
 * for finite input.
 */
export type { Failure, FailureReason, Result } from './result';

export type {
  Capacitances,
  FitProvenance,
  HeaterOption,
  HeaterWiring,
  KorenTriodeParams,
  TriodeModel,
  TubeLike,
  TubeRatings,
  TubeRecord,
  TypicalPoint,
} from './tube/types';
export { recordOf } from './tube/types';
export { triode, plateCurrent, DEFAULT_GRID_RESISTANCE, type TubeSmallSignal } from './tube/triode';
export { korenParamsProblem } from './tube/koren';
export { gridCurrent, GRID_CURRENT_ONSET, CATHODE_THERMAL_VOLTS, POWER_GRID_RESISTANCE } from './tube/gridCurrent';
export { tubeLibrary, findTube } from './tube/library';
export { LIBRARY_TUBE_IDS } from './tube/library/libraryIds';
export { korenPublishedSets } from './tube/korenPublishedSets';
export { tubeSummary, type TubeSummary } from './tube/tubeSummary';

export { solveStage, CUTOFF_CURRENT_A, type StageSolution, type OperatingPoint } from './stage/solveStage';
export { normalizeStage, STAGE_DEFAULTS, type StageDesign, type CheckedStage } from './stage/stageDesign';
export { solveFollower, type FollowerDesign, type FollowerSolution } from './stage/solveFollower';
export { followerPlane, followerRkFor, type FollowerPlane, type FollowerRk } from './stage/followerPlane';
export { designFor, type DesignTarget, type DesignAnswer } from './stage/designFor';
export { readMeter, type MeterReading, type MeterReadout, type ReadStage } from './stage/meterReading';
export { readPlateMeter, type PlateMeterReading, type PlateReadStage } from './stage/plateMeterReading';
export { readPairMeter, TAIL_AGREEMENT, type PairMeterReading, type PairMeterReadout, type PairReadStage } from './splitter/pairMeter';
export {
  designAtPlanePoint,
  nearestReachable,
  gridVoltageAt,
  MIN_DRAG_RA,
  MIN_DRAG_IA,
  type PlanePointTarget,
  type PlanePointDesign,
  type ReachablePoint,
} from './stage/designAtPoint';
export { NO_BIAS_VOLTS, type FindingInput } from './stage/findings';
export { amplifierFindings, type StageFinding } from './stage/stageFindings';
export { DISSIPATION_WARN_FRACTION, HEATER_CATHODE_WARN_FRACTION, AT_RATING_TOLERANCE, type Band, type Finding, type FindingKind, type HeaterCathodeRating, type Severity } from './stage/ratingBands';
export { plateFamily, dcLoadLine, MAX_FAMILY_CURVES, type PlanePoint, type PlateCurve } from './stage/planeSeries';
export { plateExtent, loadLineExtent, type PlateExtent } from './stage/plateExtent';
export { curveSheet, CURVE_SAMPLES, type CurveSheet } from './stage/curveSheet';
export { BIAS_SAMPLES, type StageOverlay } from './stage/stageOverlay';

export { parseValue, type ParsedValue } from './parts/parseValue';
export { formatValue } from './parts/formatValue';
export { nearestPreferred, preferredAround } from './parts/nearestPreferred';
export { E12, E24, E96, SERIES, SERIES_TOLERANCE, type PreferredSeries } from './parts/preferredValues';

export { swing, swingOf, type SwingResult, type SwingLimit } from './signal/swing';
export { levelAtThd, TABLE_THD, type LevelAtThd } from './signal/levelAtThd';
export { distortion, distortionOf, MAX_OVERDRIVE, DEFAULT_SAMPLES, type DriveLevel, type DistortionOptions, type DistortionResult } from './signal/distortion';
export { frequencyResponse, responseOf, logFrequencies, type ResponsePoint } from './signal/frequencyResponse';
export { corners, cornersOf, type Corners } from './signal/corners';
export { type ChainLink, type FollowerCoupling, type LinkResult, type LinkChainResult } from './signal/solveLinks';
export { solveChain } from './chain/solveChain';
export { amplifierNetlist, amplifierOnSupplyNetlist, type NetlistOptions } from './netlist/amplifierNetlist';
export { globalFeedback, feedbackPartsProblem, FEEDBACK_CF_LIMITS, FEEDBACK_RF_LIMITS, type GlobalFeedback } from './chain/globalFeedback';
export { squareWave, type SquareWave } from './signal/squareWave';
export { feedbackBand, type FeedbackBand, type FeedbackDivider, type LoopMargins, type LoopSquareWave } from './chain/feedbackBand';
export { windingProblem, WINDING_LIMITS, type WindingInductance } from './output/windingInductance';
export { solveAmplifier, stagesInPlaceProblem, MAX_CHAIN_STAGES } from './chain/solveAmplifier';
export { STAGE_KINDS, STAGE_KIND_LABELS } from './chain/stageKinds';
export type { ChainInput, ChainResult, ChainStage, StageKindName, StageResult, StagePins, Coupling, CapacitorCoupling, DirectCoupling, CommonCathodeLink, FollowerLink, SingleEndedLink, SplitLoadLink, LongTailedPairLink, PushPullLink, ClipCause } from './chain/chainTypes';
export { sineLevel, decibelsOf, DB_FLOOR, NO_SIGNAL_VOLTS, DBU_REFERENCE_VOLTS, type Level } from './signal/levels';
export { solvedStage, type SolvedStage } from './signal/analysisInput';
export { stageTransfer, type StageTransfer, type TransferSample } from './signal/stageTransfer';
export { type LevelThd } from './signal/distortionSweep';
export { fitTriode, type CurvePoint, type FitOptions, type TriodeFit, type FitPointError } from './fit/fitTriode';
export { parseCurveCsv, type CsvLineError } from './fit/parseCurveCsv';
export { type StageParts } from './build/chainStageParts';
export { amplifierParts, type AmplifierPartsOptions } from './build/amplifierParts';
export { stagePartsList, capacitorsForCorner, TUBE_CURRENT_SPREAD, type ResistorLine, type CapacitorLine, type CapacitorForCorner } from './build/partsList';
export { productionSpread, type Spread, type SpreadSample } from './build/spread';
export { envelopesOf, type EnvelopeCount } from './build/envelopes';
export { heaterTotals, droppingResistor, heaterElevation, decouplingFilter, HEATER_TOLERANCE, type HeaterPlan, type DroppingResistor, type DecouplingResult } from './build/supply';
export { elevationDivider, type ElevationDivider } from './build/elevationDivider';
export { RESISTOR_WATTS, CAPACITOR_VOLTS, RATING_MARGIN, roundUpTo } from './build/ratings';
export { supplyPartsList, MAINS_HIGH, DIODE_VOLTS, ELECTROLYTIC_MAX_VOLTS, type SupplyParts, type SolvedSupply, type FilterCapacitorLine, type ChokeLine, type RectifierLine } from './build/supplyParts';
export { parseTypicalCsv } from './fit/parseTypicalCsv';

export { korenPentode, type KorenPentodeParams } from './tube/pentode';
export { CONNECTIONS, connectionsOf, type Connection, type OutputTube, type OutputLaw, type PowerRatings, type SingleEndedExample } from './output/outputTube';
export { outputTubeLibrary, findOutputTube } from './output/library/index';
export { OUTPUT_LIMITS, type OutputDesign } from './output/outputDesign';
export { solveOutput, OUTPUT_CUTOFF_A, type OutputSolution, type OutputPoint } from './output/solveOutput';
export { singleEndedPins, pushPullPins } from './output/outputPins';
export { OUTPUT_SAMPLES, CUTOFF_SHARE, type DriveResult, type CleanLimit, type Waveform } from './output/outputSignal';
export { type LimitedPower, type ZSweep } from './output/powerSweep';
export { atDrive, cleanLimit, waveform, powerSweep, powerAtDistortion, zPrimarySweep, switchBias } from './output/outputCalls';
export { OUTPUT_CALL_LIMITS } from './output/checkOutput';
export { biasForPoint, type BiasAnswer } from './output/outputBias';
export { SENSE_OHMS, type BiasAdjustment } from './output/biasAdjustment';
export { readOutputMeter, type OutputMeterReading, type OutputMeterReadout } from './output/outputMeter';
export { outputBiasSupply, pairBiasSupply, type FixedBiasSupply } from './output/fixedBiasSupply';
export { type HotEnd } from './output/hotEnd';
export { mainsFuse, fullPowerVa, htFuseCurrent, bplusWindingLoad, TRANSFORMER_EFFICIENCY, FUSE_FACTOR, FUSE_AMPS, type MainsDemand, type MainsAnswer, type BplusWindingLoad } from './supply/mainsFuse';
export { solveBiasSupply, checkBiasSupply, type BiasSupplyDesign, type BiasSupplySolution, type BiasTap } from './supply/biasSupply';
export { STRING_AMPS, HOT_END_SLACK, COLD_END_MARGIN, POT_VALUES, type BiasString, type BiasReach } from './supply/biasString';
export { type BiasParts } from './build/biasParts';
export type { OutputSpread, SpreadEnd } from './output/outputSpread';
export { STOPPER_CORNER_CLEAR_HZ, type GridStopper } from './output/gridStopper';
export { settledCathode, type SettledCathode } from './output/settledCathode';
export { outputExtent, zPrimaryThrough, type OutputOverlay } from './output/outputSheet';
export { analyzeOutput, type OutputAnalysis, type OutputAnalysisOptions } from './output/analyzeOutput';
export { analyzeStage, type StageAnalysis, type StageAnalysisOptions } from './stage/analyzeStage';
export { outputPartsList, CATHODE_BYPASS_CORNER_HZ, type OutputPartsList, type TransformerSpec } from './output/outputParts';
export { screenFeedPlan, type ScreenFeedPlan } from './output/screenFeed';
export { amplifierAtLevel, type AmplifierLevel, type AmplifierAtLevel, type StageLevel } from './chain/amplifierAtLevel';
export { solveSupply } from './supply/solveSupply';
export { capacitorForRipple, MAX_SUGGESTED_FARADS } from './supply/capacitorForRipple';
export { checkSupply, MAX_SECTIONS } from './supply/checkSupply';
export { RECTIFIER_TUBES, findRectifierTube, type RectifierTube } from './supply/rectifierTubes';
export type { SupplyDesign, SupplySolution, SupplyNode, Rectifier, FilterSection } from './supply/supplyTypes';
export { SUPPLY_WARN_FRACTION } from './supply/supplyFindings';
export type { SupplyRatings } from './supply/supplyTypes';
export { solveOnSupply, solveOnSupplyInRounds, MAX_CHANNELS, type AmplifierOnSupply, type AmplifierOnSupplyResult } from './chain/solveOnSupply';
export { supplyLowEnd, SUPPLY_GAIN_MARGIN_DB, SUPPLY_PEAK_WARNING_DB, type SupplyLowEnd } from './chain/supplyLowEnd';
export { supplyHum, humAtOutput, withBiasHum, type SupplyHum, type HumAtOutput, type HumWithBias } from './chain/supplyHum';
export { humOnSupply } from './chain/humOnSupply';
export { NOISE_BAND_HZ, type ChainNoise } from './chain/chainNoise';
export { TRIODE_NOISE_RESISTANCE_GM } from './chain/chainResponse';
export { supplyTangent, supplyNear, nearbyLoads, type SupplyTangent } from './supply/supplyTangent';
export { bplusAgreement, BPLUS_AGREEMENT } from './supply/bplusAgreement';
export { bleederFor, bleederForSupply, SAFE_DC_VOLTS, BLEED_SECONDS, type Bleeder, type NeededBleeder } from './supply/bleeder';
export { heaterWindings, type HeaterLoad, type HeaterWinding } from './build/heaterWindings';
export { solvePushPull, type PushPullSolution, type PushPullTubePoint } from './pushpull/solvePushPull';
export { pushPullAtDrive, PUSH_PULL_CUTOFF_SHARE, type PushPullDrive } from './pushpull/pushPullDrive';
export { MAX_MISMATCH, RAA_LIMITS, type PushPullDesign } from './pushpull/pushPullDesign';
export { pushPullFigures, type PushPullFigures } from './pushpull/pushPullFigures';
export { settledCathodeBias, type SettledBias } from './pushpull/settledBias';
export { solveCathodyne, type CathodyneDesign, type CathodyneResult } from './splitter/cathodyne';
export { solveLongTailedPair, type LongTailedPairDesign, type LongTailedPairResult } from './splitter/longTailedPair';
export { pushPullRaaSweep, MAX_RAA_POINTS, type RaaRow } from './pushpull/raaSweep';
export { analyzePushPull, type PushPullAnalysis, type PushPullAnalysisOptions } from './pushpull/analyzePushPull';
export { raaThrough, type PushPullOverlay } from './pushpull/pushPullOverlay';
export { pairBiasForPoint, switchPairBias } from './pushpull/pairBias';
export { pushPullPartsList, type PushPullPartsList, type PairTransformerSpec } from './pushpull/pushPullParts';
export { splitterPlane, type SplitterPlane, type SplitterPlaneDesign } from './splitter/splitterPlane';
export { solveSplitter, millerInputCapacitance, type SplitterDesign, type SplitterResult, type SplitterOutput } from './splitter/solveSplitter';
export { TARGET_NAMES, TARGET_LABELS, TARGETS_OF_KIND, activeTargets, type Targets, type TargetName, type TargetStageKind } from './targets/targets';
export { UNREACHABLE, type RegionStage } from './targets/evaluatePoint';
export { feasibleRegion, type FeasibleRegion, type RegionGrid, type RegionBest } from './targets/feasibleRegion';
export { rankTubes, type TubeRank } from './targets/rankTubes';
export { followerRegion, judgeFollower, rankFollowers, FOLLOWER_SAMPLES, type FollowerRegion, type FollowerTargetStage } from './targets/followerTargets';
export { judgeDesign, type DesignVerdict } from './targets/judgeDesign';
export { preferredBest, type PreferredBest } from './targets/preferredBest';
export { outputRegion, judgeOutput, rankOutputTubes, outputTargetsOf, type OutputRegion, type OutputRegionBest, type OutputRank, type OutputParts, type OutputTargetStage } from './targets/outputTargets';
export { type PlaneRegion, type PlaneBest } from './targets/planeRegion';
export { RESPONSE_FREQUENCIES, type StageSignal, type SignalLevels } from './stage/stageSignal';
