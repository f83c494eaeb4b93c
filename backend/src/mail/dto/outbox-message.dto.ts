import { ApiProperty } from '@nestjs/swagger';
import type { OutboxMessageDto } from '@meritline/shared';

export class OutboxMessageResponseDto implements OutboxMessageDto {
  @ApiProperty() id: string;
  @ApiProperty() from: string;
  @ApiProperty({ type: [String] }) to: string[];
  @ApiProperty() subject: string;
  @ApiProperty() text: string;
  @ApiProperty({ format: 'date-time' }) receivedAt: string;
}
