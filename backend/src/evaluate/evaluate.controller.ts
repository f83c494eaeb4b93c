import { Body, Controller, Header, HttpCode, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags, ApiUnprocessableEntityResponse } from '@nestjs/swagger';
import { Throttle } from '@nestjs/throttler';
import { WorkerPoolService } from '../workers/worker-pool.service.js';

/** The engine as a service: the same result as the command line gives for the same study. */
@ApiTags('evaluate')
@ApiBearerAuth()
@Controller('evaluate')
export class EvaluateController {
  constructor(private readonly workers: WorkerPoolService) {}

  @Post()
  @HttpCode(200)
  @Header('Content-Type', 'application/json; charset=utf-8')
  @Throttle({ default: { limit: 120, ttl: 60_000 } })
  @ApiBody({
    schema: { type: 'object', additionalProperties: true, description: 'A study in the engine’s input format (at most 5 MB of JSON).' },
  })
  @ApiOkResponse({ schema: { type: 'object', additionalProperties: true, description: 'The engine’s result.' } })
  @ApiUnprocessableEntityResponse({
    description: '{ statusCode, message, errors: [{ field, code, message }] } for a study the engine cannot evaluate.',
  })
  evaluate(@Body() study: Record<string, unknown>): Promise<string> {
    return this.workers.engine(study);
  }
}
