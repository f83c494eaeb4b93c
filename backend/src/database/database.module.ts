import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { typeormOptions } from './typeorm-options.js';
import { DemoSeedService } from './seeds/demo-seed.service.js';

@Module({
  imports: [
    TypeOrmModule.forRootAsync({
      inject: [appConfig.KEY],
      useFactory: (config: AppConfigType) => typeormOptions(config.database),
    }),
  ],
  providers: [DemoSeedService],
})
export class DatabaseModule {}
