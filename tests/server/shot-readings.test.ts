import { AuditEventModel, ToolModel, ToolShotReadingModel } from '../../server/models';
import { recordShotReading } from '../../server/services/shot-readings';
import { makeBrand, makeFactory, makeUser, openTestApp } from './helpers';
import { makeTool } from './registry-helpers';

const t = openTestApp();
afterAll(() => t.close());

async function setup(shotCount = 1000) {
  const brand = await makeBrand();
  const factory = await makeFactory();
  const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, shotCount });
  const { user } = await makeUser('engineer', { brandIds: [brand.id] });
  return { tool, user };
}

describe('recordShotReading', () => {
  it('when a reading is higher than the last, then it is stored, the counter and last run date follow and it is audited', async () => {
    const { tool, user } = await setup(1000);
    const out = await t.sequelize.transaction((tx) =>
      recordShotReading({ toolId: tool.id, reading: 5000, readAt: '2026-11-20', source: 'factory', userId: user.id, requestId: null }, tx),
    );
    expect(out).toMatchObject({ reading: 5000, previous: 1000, source: 'factory', recordedBy: user.id });
    const after = await ToolModel.findByPk(tool.id);
    expect(after!.shotCount).toBe(5000);
    expect(after!.lastRunDate).toBe('2026-11-20');
    const audit = await AuditEventModel.findOne({ where: { entityId: tool.id, action: 'tool.shot_reading' } });
    expect(audit!.after).toMatchObject({ shotCount: 5000, readingId: out.id });
  });

  it('when a reading is lower than the last reading, then 422 on reading and nothing is stored', async () => {
    const { tool, user } = await setup(1000);
    await t.sequelize.transaction((tx) =>
      recordShotReading({ toolId: tool.id, reading: 8000, readAt: '2026-11-20', source: 'factory', userId: user.id, requestId: null }, tx),
    );
    const attempt = t.sequelize.transaction((tx) =>
      recordShotReading({ toolId: tool.id, reading: 7999, readAt: '2026-11-21', source: 'engineer', userId: user.id, requestId: null }, tx),
    );
    await expect(attempt).rejects.toMatchObject({ status: 422, code: 'validation_failed', fieldErrors: { reading: [expect.stringMatching(/8,000/)] } });
    expect(await ToolShotReadingModel.count({ where: { toolId: tool.id } })).toBe(1);
    expect((await ToolModel.findByPk(tool.id))!.shotCount).toBe(8000);
  });

  it('when the first reading is below the counter the tool was registered with, then 422', async () => {
    const { tool, user } = await setup(20_000);
    const attempt = t.sequelize.transaction((tx) =>
      recordShotReading({ toolId: tool.id, reading: 19_999, readAt: '2026-11-20', source: 'factory', userId: user.id, requestId: null }, tx),
    );
    await expect(attempt).rejects.toMatchObject({ status: 422, fieldErrors: { reading: expect.any(Array) } });
  });

  it('when the same reading is given again, then it is kept and the last run date does not move', async () => {
    const { tool, user } = await setup(1000);
    await t.sequelize.transaction((tx) =>
      recordShotReading({ toolId: tool.id, reading: 1000, readAt: '2026-11-20', source: 'engineer', userId: user.id, requestId: null }, tx),
    );
    expect((await ToolModel.findByPk(tool.id))!.lastRunDate).toBeNull();
    expect(await ToolShotReadingModel.count({ where: { toolId: tool.id } })).toBe(1);
  });

  it('when the tool is disposed, then the reading is refused', async () => {
    const { tool, user } = await setup(1000);
    await tool.update({ status: 'disposed' });
    const attempt = t.sequelize.transaction((tx) =>
      recordShotReading({ toolId: tool.id, reading: 2000, readAt: '2026-11-20', source: 'factory', userId: user.id, requestId: null }, tx),
    );
    await expect(attempt).rejects.toMatchObject({ status: 409 });
  });
});
