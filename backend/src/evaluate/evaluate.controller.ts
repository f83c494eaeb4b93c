import { Body, Controller, Header, HttpCode, Post } from '@nestjs/common';
import { ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Throttle } from '@nestjs/throttler';
import { ApiInvalid, ApiSignedIn } from '../common/openapi/api-responses.js';
import { EvaluationResultDto } from './dto/evaluation-result.dto.js';
import { unprocessable } from '../common/validation.js';
import { WorkerPoolService } from '../workers/worker-pool.service.js';

/** The engine as a service: the same result as the command line gives for the same study. */
@ApiTags('evaluate')
@ApiSignedIn()
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
  @ApiOkResponse({ type: EvaluationResultDto, description: 'The engine’s result.' })
  @ApiInvalid('A study the engine cannot evaluate: one entry per field.')
  evaluate(@Body() study: unknown): Promise<string> {
    // No DTO stands in front of the engine: a body that is not a JSON object (or not JSON at all) stops here.
    if (study === null || typeof study !== 'object' || Array.isArray(study)) {
      throw unprocessable([
        { field: 'body', code: 'notAnObject', message: 'Send the study as a JSON object (Content-Type: application/json).' },
      ]);
    }
    return this.workers.engine(study as Record<string, unknown>);
  }
}
