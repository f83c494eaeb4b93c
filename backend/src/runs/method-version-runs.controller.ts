import { Controller, Get, Param, ParseUUIDPipe } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import { Roles } from '../common/decorators/roles.decorator.js';
import { RunsService, type RunControlChart, type RunOptions } from './runs.service.js';

/** What routine runs need to know about a method version. */
@ApiTags('runs')
@ApiBearerAuth()
@Roles(Role.Analyst, Role.Reviewer, Role.QualityManager)
@Controller('method-versions/:id')
export class MethodVersionRunsController {
  constructor(private readonly runsService: RunsService) {}

  @Get('run-options')
  runOptions(@Param('id', ParseUUIDPipe) id: string): Promise<RunOptions> {
    return this.runsService.runOptions(id);
  }

  @Get('control-chart')
  controlChart(@Param('id', ParseUUIDPipe) id: string): Promise<RunControlChart> {
    return this.runsService.controlChart(id);
  }
}
