/**
 * Names the web app uses for the API's types. Everything comes from the client generated out of
 * apps/api/openapi.json (`npm run client -w @roundbook/web`), so a change in the API contract breaks
 * the web build instead of failing at run time.
 */
import type { components, paths as generatedPaths } from '@/api/generated/schema';

type Schemas = components['schemas'];

export type paths = generatedPaths;

export type ProjectRole = Schemas['ProjectRole'];
export type ExcavationStage = Schemas['Stage'];
export type TriggerLevel = Schemas['TriggerLevel'];
export type ApiErrorBody = Schemas['ErrorResponseDto'];
export type LoginRequest = Schemas['LoginDto'];
export type UserSummary = Schemas['UserDto'];
export type LoginResponse = Schemas['TokenResponseDto'];
export type ChangePasswordRequest = Schemas['ChangePasswordDto'];
export type Membership = Schemas['MembershipDto'];
export type CurrentUser = Schemas['MeDto'];
export type HandoverSummary = Schemas['LastHandoverDto'];
export type HeadingSummary = Schemas['HeadingSummaryDto'];
export type ProjectSummary = Schemas['ProjectSummaryDto'];
export type MailAttachment = Schemas['MailAttachmentDto'];
export type MailMessage = Schemas['MailMessageDto'];

/**
 * `GET /api/config`. The OpenAPI document describes its body as an empty object (AppInfoDto has no
 * properties yet), so the fetcher checks the two fields itself.
 */
export interface AppConfig {
  localMode: boolean;
  version: string;
}

export type PlaneNotation = Schemas['PlaneNotation'];
export type QTableEdition = Schemas['QTableEdition'];
export type GroundScale = Schemas['GroundScale'];
export type UpdateProjectRequest = Schemas['UpdateProjectDto'];
export type ChainageStyle = Schemas['ChainageStyle'];
export type ProfileShape = Schemas['ProfileShape'];
export type Heading = Schemas['HeadingDto'];
export type CreateHeadingRequest = Schemas['CreateHeadingDto'];
export type UpdateHeadingRequest = Schemas['UpdateHeadingDto'];
export type SupportClass = Schemas['SupportClassDto'];
export type SupportClassLibrary = Schemas['SupportClassLibraryDto'];
export type RangeWarning = Schemas['RangeWarningDto'];
export type CreateSupportClassRequest = Schemas['CreateSupportClassDto'];
export type UpdateSupportClassRequest = Schemas['UpdateSupportClassDto'];
export type WatchedQuantity = Schemas['WatchedQuantity'];
export type Comparison = Schemas['Comparison'];
export type TriggerFires = Schemas['TriggerFires'];
export type TriggerRule = Schemas['TriggerRuleDto'];
export type CreateTriggerRuleRequest = Schemas['CreateTriggerRuleDto'];
export type UpdateTriggerRuleRequest = Schemas['UpdateTriggerRuleDto'];
export type TeamMember = Schemas['MemberDto'];
export type Invitation = Schemas['InvitationDto'];
export type Team = Schemas['TeamDto'];
export type InviteRequest = Schemas['InviteDto'];
export type InvitationInfo = Schemas['InvitationInfoDto'];
export type AcceptInvitationRequest = Schemas['AcceptInvitationDto'];
export type CreateProjectRequest = Schemas['CreateProjectDto'];

export type Hazard = Schemas['HazardDto'];
export type HazardKind = Schemas['HazardKind'];
export type CreateHazardRequest = Schemas['CreateHazardDto'];
export type UpdateHazardRequest = Schemas['UpdateHazardDto'];
export type CloseHazardRequest = Schemas['CloseHazardDto'];

export type SupportRecord = Schemas['SupportRecordDto'];
export type SupportRecordItem = Schemas['SupportItemDto'];
export type SaveSupportRecordRequest = Schemas['SaveSupportRecordDto'];

export type NoticeSettings = Schemas['NoticeSettingsDto'];
export type UpdateNoticeSettingsRequest = Schemas['UpdateNoticeSettingsDto'];
