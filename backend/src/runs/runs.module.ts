import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MethodVersion } from '../methods/method-version.entity.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { User } from '../users/user.entity.js';
import { MethodVersionRunsController } from './method-version-runs.controller.js';
import { Run } from './run.entity.js';
import { RunsController } from './runs.controller.js';
import { RunsService } from './runs.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Run, MethodVersion, ValidationStudy, User])],
  controllers: [RunsController, MethodVersionRunsController],
  providers: [RunsService],
})
export class RunsModule {}
