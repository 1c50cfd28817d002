import type { DataSource } from 'typeorm';
import { User } from '../modules/users/user.entity';
import { seedDemoAccounts } from './demo-accounts';
import { seedDemoCampaign } from './demo-campaign';

/** Seeds the demo on an empty database (no users yet); returns whether it did. */
export async function seedDemoIfEmpty(dataSource: DataSource): Promise<boolean> {
  if ((await dataSource.getRepository(User).count()) > 0) return false;
  await seedDemoAccounts(dataSource);
  await seedDemoCampaign(dataSource);
  return true;
}
