import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags, ApiUnprocessableEntityResponse } from '@nestjs/swagger';
import { evaluateStudy, type EvaluationResult } from '@meritline/shared';

/** The engine as a service: the same result as the command line gives for the same study. */
@ApiTags('evaluate')
@ApiBearerAuth()
@Controller('evaluate')
export class EvaluateController {
  @Post()
  @HttpCode(200)
  @ApiBody({
    schema: { type: 'object', additionalProperties: true, description: 'A study in the engine’s input format (at most 5 MB of JSON).' },
  })
  @ApiOkResponse({ schema: { type: 'object', additionalProperties: true, description: 'The engine’s result.' } })
  @ApiUnprocessableEntityResponse({
    description: '{ statusCode, message, errors: [{ field, code, message }] } for a study the engine cannot evaluate.',
  })
  evaluate(@Body() study: Record<string, unknown>): EvaluationResult {
    return evaluateStudy(study);
  }
}
