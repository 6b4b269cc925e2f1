import { type TestDataSource, openTestDataSource } from '../fixtures/test-data-source';

describe('migrations', () => {
  let db: TestDataSource;
  beforeAll(async () => {
    db = await openTestDataSource();
  });
  afterAll(() => db.close());

  it('build exactly the schema the entities describe', async () => {
    const pending = await db.dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('have all run, and none is left to run', async () => {
    await expect(db.dataSource.showMigrations()).resolves.toBe(false);
  });
});
