import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import { Role, type OutboxMessageDto } from '@meritline/shared';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiSignedIn } from '../common/openapi/api-responses.js';
import { OutboxMessageResponseDto } from './dto/outbox-message.dto.js';
import { OutboxMessage } from './outbox-message.entity.js';

@ApiTags('outbox')
@ApiSignedIn('Administrators only.')
@Roles(Role.Admin)
@Controller('outbox')
export class OutboxController {
  constructor(@InjectRepository(OutboxMessage) private readonly outbox: Repository<OutboxMessage>) {}

  @Get()
  @ApiOkResponse({ type: [OutboxMessageResponseDto], description: 'The newest 500 messages the SMTP sink received.' })
  async findAll(): Promise<OutboxMessageDto[]> {
    const messages = await this.outbox.find({ order: { receivedAt: 'DESC' }, take: 500 });
    return messages.map((m) => ({
      id: m.id,
      from: m.from,
      to: m.to,
      subject: m.subject,
      text: m.text,
      receivedAt: m.receivedAt.toISOString(),
    }));
  }
}
