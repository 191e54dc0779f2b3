export { analyzeIq, createIqAnalyzer, MIN_IQ_SAMPLES } from './analyze-iq';
export type { IqAnalysis, IqAnalysisOptions } from './analyze-iq';
export { CARRIER_RBW_LIMIT_HZ, defaultSegmentLength } from './default-segment-length';
