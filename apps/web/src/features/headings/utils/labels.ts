// The words of the heading codes: packages/domain's vocabulary (the same in the API, e-mails and reports).
export {
  chainageStyleLabels,
  PROFILE_SHAPES,
  profileShapeLabels,
  STAGES,
  stageLabels,
} from '@roundbook/domain';
