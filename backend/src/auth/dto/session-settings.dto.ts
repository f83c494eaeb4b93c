import { ApiProperty } from '@nestjs/swagger';
import { IsInt, Max, Min } from 'class-validator';
import { IDLE_MINUTES_MAX, IDLE_MINUTES_MIN, type SessionSettingsDto } from '@meritline/shared';

export class UpdateSessionSettingsDto implements SessionSettingsDto {
  @ApiProperty({ minimum: IDLE_MINUTES_MIN, maximum: IDLE_MINUTES_MAX, example: 30 })
  @IsInt({ message: 'Enter a whole number of minutes.' })
  @Min(IDLE_MINUTES_MIN, { message: `Use at least ${IDLE_MINUTES_MIN} minutes.` })
  @Max(IDLE_MINUTES_MAX, { message: `Use at most ${IDLE_MINUTES_MAX} minutes.` })
  idleMinutes: number;
}
