// The tool's life after its changes: shot readings (and, with them, repairs, moves, end of life and
// payments); called from initModels (index.ts).
import type { Sequelize } from 'sequelize';
import { ToolShotReadingModel } from './tool-shot-reading';

export function initToolLifeModels(sequelize: Sequelize) {
  for (const m of [ToolShotReadingModel]) m.initModel(sequelize);
}

export { ToolShotReadingModel };
