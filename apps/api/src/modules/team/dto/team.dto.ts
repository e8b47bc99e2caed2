import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsIn, IsOptional, IsString, Length, MaxLength, MinLength } from 'class-validator';
import { PROJECT_ROLES } from '../../../common/auth/auth-user.js';

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
  /** Whether the e-mail reached the mail server; if not, resend it */
  emailSent: boolean;
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

  @IsOptional()
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
  /** True when the e-mail already has a Roundbook account: accept with its password */
  accountExists: boolean;
}

export class AcceptInvitationDto {
  /** Your name as colleagues know it (new accounts) */
  @IsOptional()
  @IsString()
  @Length(1, 120)
  name?: string;

  /** A new password (new accounts, at least 10 characters) or your existing password */
  @IsString()
  @MinLength(10, { message: 'Use at least 10 characters.' })
  @MaxLength(200)
  password: string;
}
