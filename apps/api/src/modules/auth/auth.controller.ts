import { Body, Controller, Get, Header, HttpCode, Inject, Ip, Post, UseGuards } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
  ApiTooManyRequestsResponse,
  ApiUnauthorizedResponse,
} from '@nestjs/swagger';
import { SkipThrottle, ThrottlerGuard } from '@nestjs/throttler';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { CurrentUser } from '../../common/auth/current-user.decorator.js';
import { Public } from '../../common/auth/public.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { AuthService } from './auth.service.js';
import { ChangePasswordDto, LoginDto } from './dto/login.dto.js';
import { MeDto, TokenResponseDto } from './dto/token-response.dto.js';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(@Inject(AuthService) private readonly auth: AuthService) {}

  /** Signs in with e-mail and password; returns a bearer token. Failures are limited per account and per address, with back-off. */
  @Public()
  @UseGuards(ThrottlerGuard)
  @SkipThrottle({ login: true })
  @Post('login')
  @Header('Cache-Control', 'no-store')
  @HttpCode(200)
  @ApiOkResponse({ type: TokenResponseDto })
  @ApiUnauthorizedResponse({ type: ErrorResponseDto, description: 'INVALID_CREDENTIALS' })
  @ApiTooManyRequestsResponse({ type: ErrorResponseDto, description: 'TOO_MANY_REQUESTS' })
  login(@Body() body: LoginDto, @Ip() address: string): Promise<TokenResponseDto> {
    return this.auth.login(body.email, body.password, address);
  }

  /** Signs this account out on every device: every token issued so far stops working */
  @ApiBearerAuth()
  @Post('sign-out-everywhere')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'Every token of the account is revoked' })
  signOutEverywhere(@CurrentUser() user: AuthUser): Promise<void> {
    return this.auth.signOutEverywhere(user);
  }

  /** A new password (the current one asked again); every other session ends, this one gets a new token */
  @ApiBearerAuth()
  @Post('password')
  @Header('Cache-Control', 'no-store')
  @HttpCode(200)
  @ApiOkResponse({ type: TokenResponseDto })
  changePassword(
    @CurrentUser() user: AuthUser,
    @Body() body: ChangePasswordDto,
    @Ip() address: string,
  ): Promise<TokenResponseDto> {
    return this.auth.changePassword(user, body.currentPassword, body.newPassword, address);
  }

  /** The signed-in user and their project memberships */
  @ApiBearerAuth()
  @Get('me')
  @Header('Cache-Control', 'no-store')
  @ApiOkResponse({ type: MeDto })
  me(@CurrentUser() user: AuthUser): Promise<MeDto> {
    return this.auth.me(user);
  }
}
