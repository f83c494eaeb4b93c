import { Module } from '@nestjs/common';
import { PreparationsModule } from '../preparations/preparations.module.js';
import { StudiesController } from './studies.controller.js';
import { StudiesService } from './studies.service.js';

@Module({
  imports: [PreparationsModule],
  controllers: [StudiesController],
  providers: [StudiesService],
  exports: [StudiesService],
})
export class StudiesModule {}
