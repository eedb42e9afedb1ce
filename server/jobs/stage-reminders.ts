// Overdue stage reminders: checked every hour, sent at most once a day (UTC) for each time a
// request entered a stage (server/services/workflow.ts runStageReminders keeps the record).
import { runStageReminders } from '../services/workflow';
import { registerSchedule } from './schedules';

export const STAGE_REMINDER_CHECK_MS = 60 * 60 * 1000;

let registered = false;

export function registerStageReminders() {
  if (registered) return;
  registered = true;
  registerSchedule({
    name: 'stage-reminders',
    everyMs: STAGE_REMINDER_CHECK_MS,
    run: async (deps) => {
      await runStageReminders(deps);
    },
  });
}
