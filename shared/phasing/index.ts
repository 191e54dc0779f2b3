export { diagnosePhasing } from './diagnose-phasing';
export type { PhasingDiagnosis } from './diagnose-phasing';
export {
  amplitudeImbalanceForSuppressionDb,
  imageRejectionDb,
  imageRejectionSmallErrorDb,
  phaseErrorForSuppressionDeg,
} from './image-rejection';
export type { PhasingErrors } from './image-rejection';
