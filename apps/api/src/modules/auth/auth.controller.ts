import { Body, Controller, Get, Header, HttpCode, Inject, Ip, Post, UseGuards } from '@nestjs/common';
import {
  ApiBearerAuth,
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
import { LoginDto } from './dto/login.dto.js';
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

  /** The signed-in user and their project memberships */
  @ApiBearerAuth()
  @Get('me')
  @Header('Cache-Control', 'no-store')
  @ApiOkResponse({ type: MeDto })
  me(@CurrentUser() user: AuthUser): Promise<MeDto> {
    return this.auth.me(user);
  }
}
