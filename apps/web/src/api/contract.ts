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
