import { plain } from '../../format';

/** How a margin reads: the share by which a target is met, or missed. */
export const marginWords = (m: number) => `${m >= 0 ? 'met with' : 'missed by'} ${plain(Math.abs(m) * 100)} %`;
