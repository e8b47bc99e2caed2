export class AppInfoDto {
  /** Local mode: the SMTP fake's inbox is available to admins */
  localMode: boolean;
  version: string;
}
