export class LocalAccessDto {
  /** LOCAL_MODE=true and a local inbox folder: the local mail view exists */
  localMode: boolean;
  /** The caller is an operator of this instance (not a project role) */
  operator: boolean;
}
