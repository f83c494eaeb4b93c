import { Global, Module } from '@nestjs/common';
import { WorkerPoolService } from './worker-pool.service.js';

@Global()
@Module({ providers: [WorkerPoolService], exports: [WorkerPoolService] })
export class WorkersModule {}
