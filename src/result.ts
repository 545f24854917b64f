/**
 * Every public model function answers with a Result: the value, or a typed
 * failure whose `reason` the UI can branch on and whose `message` it can show
 * as is. The model never throws and never returns NaN for finite input.
 */
export type FailureReason =
  | 'invalid-input'
  | 'invalid-tube'
  | 'cutoff'
  | 'grid-current'
  | 'supply-too-low'
  | 'unreachable'
  | 'clipping'
  | 'no-convergence';

export interface Failure {
  readonly ok: false;
  readonly reason: FailureReason;
  readonly message: string;
  /** The design field the failure is about, when there is one (for showing it next to that field). */
  readonly field?: string;
}

export type Result<T> = ({ readonly ok: true } & T) | Failure;

export function fail(reason: FailureReason, message: string, field?: string): Failure {
  return field === undefined ? { ok: false, reason, message } : { ok: false, reason, message, field };
}
