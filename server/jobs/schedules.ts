// Periodic work (reminders for overdue stages and the like). Features register tasks here.
import type { Sequelize } from 'sequelize';
import type PgBoss from 'pg-boss';

export interface ScheduleDeps {
  sequelize: Sequelize;
  boss: PgBoss;
}

type Task = { name: string; everyMs: number; run: (deps: ScheduleDeps) => Promise<void> };
const tasks: Task[] = [];

export function registerSchedule(task: Task) {
  tasks.push(task);
}

export async function startSchedules(deps: ScheduleDeps) {
  const timers = tasks.map((t) =>
    setInterval(() => {
      t.run(deps).catch((err: Error) => console.error(`scheduled task ${t.name} failed:`, err.message));
    }, t.everyMs),
  );
  return () => timers.forEach(clearInterval);
}
