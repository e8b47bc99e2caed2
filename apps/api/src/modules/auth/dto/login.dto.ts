import { Transform } from 'class-transformer';
import { IsEmail, IsNotEmpty, IsString, MaxLength, MinLength } from 'class-validator';

export class ChangePasswordDto {
  /** The password the account signs in with now */
  @IsString()
  @IsNotEmpty({ message: 'Type your current password.' })
  @MaxLength(200)
  currentPassword: string;

  /** At least 10 characters */
  @IsString()
  @MinLength(10, { message: 'Choose a password of at least 10 characters.' })
  @MaxLength(200)
  newPassword: string;
}

export class LoginDto {
  /** The e-mail address the account was created with */
  @Transform(({ value }: { value: unknown }) =>
    typeof value === 'string' ? value.trim().toLowerCase() : value,
  )
  @IsEmail({}, { message: 'Enter an e-mail address such as name@example.org.' })
  @MaxLength(254)
  email: string;

  @IsString()
  @IsNotEmpty({ message: 'Enter your password.' })
  @MaxLength(200)
  password: string;
}
