export { formatEmissionDesignator, parseEmissionDesignator } from './emission-designator';
export type { EmissionDesignator } from './emission-designator';
export { h3eNecessaryBandwidthHz, j3eNecessaryBandwidthHz } from './necessary-bandwidth';
export { formatNecessaryBandwidth, parseNecessaryBandwidthCode } from './necessary-bandwidth-code';
export { occupiedBandwidthFromPowers, occupiedBandwidthFromTrace } from './occupied-bandwidth';
export type { BandLimits, OccupiedBandwidthOptions } from './occupied-bandwidth';
export { xDbBandwidth } from './x-db-bandwidth';
export type { XDbBandwidth } from './x-db-bandwidth';
