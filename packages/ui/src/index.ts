export { roundbookBrand } from './theme/brand';
export {
  getRoundbookTheme,
  roundbookFontFamily,
  roundbookHighContrastTheme,
  roundbookLightTheme,
} from './theme/theme';
export type { RoundbookThemeMode } from './theme/theme';
export { TOUCH_TARGET_PX, useTouchTargetStyles } from './theme/touch';
export { PageHeader } from './components/page-header/page-header';
export type { PageHeaderProps } from './components/page-header/page-header';
export { EmptyState } from './components/empty-state/empty-state';
export type { EmptyStateProps } from './components/empty-state/empty-state';
export { RoleBadge, roleLabels } from './components/role-badge/role-badge';
export type { ProjectRole, RoleBadgeProps } from './components/role-badge/role-badge';
export { FormikInputField } from './forms/formik-input-field';
export type { FormikInputFieldProps } from './forms/formik-input-field';
export { FormikSelectField } from './forms/formik-select-field';
export type { FormikSelectFieldProps, SelectOption } from './forms/formik-select-field';
export { FormFooter } from './forms/form-footer';
export type { FormFooterProps } from './forms/form-footer';
export { FormSection } from './forms/form-section';
export type { FormSectionProps } from './forms/form-section';
export { ConfirmDialog } from './components/confirm-dialog/confirm-dialog';
export type { ConfirmDialogProps } from './components/confirm-dialog/confirm-dialog';
export { StaleVersionNotice } from './components/stale-version-notice/stale-version-notice';
export type {
  StaleVersionNoticeProps,
  VersionDifference,
} from './components/stale-version-notice/stale-version-notice';
export { TriggerLevelBadge, triggerLevelLabels } from './components/trigger-level-badge/trigger-level-badge';
export type {
  TriggerLevel,
  TriggerLevelBadgeProps,
} from './components/trigger-level-badge/trigger-level-badge';
export { CalendarDateInput } from './forms/calendar-date-input';
export type { CalendarDateInputProps } from './forms/calendar-date-input';
