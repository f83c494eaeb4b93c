import { ApiProperty } from '@nestjs/swagger';
import type { NotificationDto, NotificationListDto } from '@meritline/shared';

export class NotificationResponseDto implements NotificationDto {
  @ApiProperty() id: string;
  @ApiProperty() kind: string;
  @ApiProperty() message: string;
  @ApiProperty({ type: String, nullable: true, description: 'The screen the notice is about, as a path of the app.' }) link: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) readAt: string | null;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
}

export class NotificationListResponseDto implements NotificationListDto {
  @ApiProperty({ type: [NotificationResponseDto] }) items: NotificationResponseDto[];
  @ApiProperty() unread: number;
}

export class MarkedReadDto {
  @ApiProperty({ description: 'Notices marked read.' }) marked: number;
}
