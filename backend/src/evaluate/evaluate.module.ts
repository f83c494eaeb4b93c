import { Module } from '@nestjs/common';
import { EvaluateController } from './evaluate.controller.js';

@Module({ controllers: [EvaluateController] })
export class EvaluateModule {}
