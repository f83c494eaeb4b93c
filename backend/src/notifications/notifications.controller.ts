import { Controller, Get, HttpCode, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { MarkedReadDto, NotificationListResponseDto, NotificationResponseDto } from './dto/notification.dto.js';
import { NotificationsService } from './notifications.service.js';
import type { NotificationDto, NotificationListDto } from '@meritline/shared';

@ApiTags('notifications')
@ApiSignedIn()
@Controller('notifications')
export class NotificationsController {
  constructor(private readonly notificationsService: NotificationsService) {}

  @Get()
  @ApiOkResponse({ type: NotificationListResponseDto })
  list(@CurrentUser() user: AuthUser): Promise<NotificationListDto> {
    return this.notificationsService.listFor(user.id);
  }

  @Post('read-all')
  @HttpCode(200)
  @ApiOkResponse({ type: MarkedReadDto })
  readAll(@CurrentUser() user: AuthUser): Promise<{ marked: number }> {
    return this.notificationsService.markAllRead(user.id);
  }

  @Post(':id/read')
  @HttpCode(200)
  @ApiOkResponse({ type: NotificationResponseDto })
  @ApiRecord('notification of the caller')
  read(@Param('id', ParseUUIDPipe) id: string, @CurrentUser() user: AuthUser): Promise<NotificationDto> {
    return this.notificationsService.markRead(id, user.id);
  }
}
