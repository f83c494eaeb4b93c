import { ApiProperty } from '@nestjs/swagger';
import { Role, type UserDto } from '@meritline/shared';

export class UserResponseDto implements UserDto {
  @ApiProperty() id: string;
  @ApiProperty() email: string;
  @ApiProperty() name: string;
  @ApiProperty({ enum: Role, isArray: true }) roles: Role[];
  @ApiProperty() active: boolean;
  @ApiProperty({ description: 'Invited, and the invitation not yet accepted.' }) invitationPending: boolean;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) lastSignInAt: string | null;
}
