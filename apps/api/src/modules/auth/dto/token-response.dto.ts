import { ApiProperty } from '@nestjs/swagger';

export class UserDto {
  id: string;
  email: string;
  name: string;
}

export class TokenResponseDto {
  /** Bearer token for the Authorization header */
  accessToken: string;
  /** When the token expires (ISO 8601) */
  expiresAt: string;
  user: UserDto;
}

export const ROLE_ENUM = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'];

export class MembershipDto {
  projectId: string;
  projectName: string;
  @ApiProperty({ enum: ROLE_ENUM, enumName: 'ProjectRole' })
  role: 'admin' | 'geologist' | 'engineer' | 'supervisor' | 'viewer';
}

export class MeDto extends UserDto {
  memberships: MembershipDto[];
  /** The caller may create projects here (PROJECT_CREATION=anyone, or an operator of this instance) */
  canCreateProjects: boolean;
}
