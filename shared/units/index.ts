export { CompensatedSum, compensatedSum } from './compensated-sum';
export { dbToLinearPower, linearPowerToDb } from './db-ratio';
export { dbmToDbuv, dbuvToDbm } from './dbuv-conversions';
export {
  dbmToDbw,
  dbmToMilliwatts,
  dbmToWatts,
  dbwToDbm,
  milliwattsToDbm,
  wattsToDbm,
} from './power-level-conversions';
export { hzToPpm, ppmToHz } from './ppm';
export { sumPowersDbm } from './sum-powers-dbm';
export {
  requireArrayLike,
  requireFinite,
  requireLevelDb,
  requireNonNegative,
  requireNumber,
  requirePositive,
} from './number-guards';
