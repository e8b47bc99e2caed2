import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsIn, IsString, Length, MaxLength, MinLength } from 'class-validator';
import { PROJECT_ROLES } from '../../../common/auth/auth-user.js';
import { Optional } from '../../../common/dto/optional.js';
import { TokenResponseDto } from '../../auth/dto/token-response.dto.js';

export class MemberDto {
  memberId: string;
  userId: string;
  name: string;
  email: string;
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  role: (typeof PROJECT_ROLES)[number];
  /** When they joined the project */
  since: string;
}

export class InvitationDto {
  id: string;
  email: string;
  name: string;
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  role: (typeof PROJECT_ROLES)[number];
  expiresAt: string;
  invitedBy: string;
  /** Whether the e-mail reached the mail server */
  emailSent: boolean;
  /** queued: waiting for the worker (or retrying while the mail server is away); sent; failed: resend it */
  @ApiProperty({ enum: ['queued', 'sent', 'failed'], enumName: 'InvitationEmailStatus' })
  emailStatus: 'queued' | 'sent' | 'failed';
}

export class TeamDto {
  members: MemberDto[];
  /** Invitations not yet accepted and not expired */
  invitations: InvitationDto[];
}

const lower = ({ value }: { value: unknown }): unknown =>
  typeof value === 'string' ? value.trim().toLowerCase() : value;

export class InviteDto {
  @Transform(lower)
  @IsEmail({}, { message: 'Enter an e-mail address such as name@example.org.' })
  @MaxLength(254)
  email: string;

  @Optional()
  @IsString()
  @Length(0, 120)
  name?: string;

  @IsIn(PROJECT_ROLES, { message: 'Choose one of: admin, geologist, engineer, supervisor, viewer.' })
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  role: (typeof PROJECT_ROLES)[number];
}

export class ChangeRoleDto {
  @IsIn(PROJECT_ROLES, { message: 'Choose one of: admin, geologist, engineer, supervisor, viewer.' })
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  role: (typeof PROJECT_ROLES)[number];
}

export class InvitationInfoDto {
  projectName: string;
  email: string;
  name: string;
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  role: (typeof PROJECT_ROLES)[number];
  expiresAt: string;
}

export class AcceptInvitationDto {
  /** Your name as colleagues know it (new accounts) */
  @Optional()
  @IsString()
  @Length(1, 120)
  name?: string;

  /** The new account's password (at least 10 characters); not needed when signed in as the invited address */
  @Optional()
  @IsString()
  @MinLength(10, { message: 'Use at least 10 characters.' })
  @MaxLength(200)
  password?: string;
}

export class AcceptedInvitationDto {
  projectId: string;
  /** True when accepting created the account */
  newAccount: boolean;
  /** A session for the new account (absent when the caller was already signed in) */
  session?: TokenResponseDto;
}
