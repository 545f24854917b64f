/// <reference lib="webworker" />
import { expose } from 'comlink';
import { readTubesFile } from '../keep/customTubes';
import { fitJob } from './fitJob';
import { feasibleRegion, followerRegion, outputRegion, rankFollowers, rankOutputTubes, rankTubes, solveOnSupply, supplyLowEnd } from '../../src/index';

/**
 * The Web Worker that runs what would freeze the page: fits of many points
 * and reading large tubes files, the target region and the tube ranking,
 * and the amplifier solved on its supply. comlink (a small, well-kept wrapper) turns
 * the message passing into plain async calls.
 */
const api = { fitJob, readTubesFile, feasibleRegion, rankTubes, followerRegion, rankFollowers, outputRegion, rankOutputTubes, solveOnSupply, supplyLowEnd };
export type ModelWorkerApi = typeof api;
expose(api);
