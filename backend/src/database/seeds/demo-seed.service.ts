import { Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import { DataSource, type EntityManager } from 'typeorm';
import { User } from '../../users/user.entity.js';
import { seedDemoMethods } from './demo-methods.seed.js';
import { seedDemoReviews } from './demo-reviews.seed.js';
import { seedDemoRuns } from './demo-runs.seed.js';
import { seedDemoStandards } from './demo-standards.seed.js';
import { seedDemoStudies } from './demo-studies.seed.js';
import { seedDemoUsers } from './demo-users.seed.js';
import { writeTransaction } from '../write-transaction.js';

export type DemoSeeder = (manager: EntityManager) => Promise<void>;

/** Seeders run in this order, in one transaction, only on an empty database. */
const seeders: DemoSeeder[] = [seedDemoUsers, seedDemoMethods, seedDemoStudies, seedDemoReviews, seedDemoRuns, seedDemoStandards];

@Injectable()
export class DemoSeedService implements OnApplicationBootstrap {
  private readonly logger = new Logger(DemoSeedService.name);

  constructor(private readonly dataSource: DataSource) {}

  async onApplicationBootstrap() {
    if (process.env.SEED_DEMO === 'false') return;
    if ((await this.dataSource.getRepository(User).count()) > 0) return;
    await writeTransaction(this.dataSource, async (manager) => {
      for (const seed of seeders) await seed(manager);
    });
    this.logger.log('Empty database: demo data seeded (demo accounts use the password "meritline-demo").');
  }
}
