import type PgBoss from "pg-boss";

const DEADLOCK = "40P01";
const ATTEMPTS = 20;

/**
 * Makes a pg-boss queue unless it exists. pg-boss's create_queue inserts the queue's row and then adds
 * a foreign key to that table in the same transaction, so two processes making queues at the same
 * moment (several servers starting on a new database) can deadlock; PostgreSQL then cancels one, which
 * tries again after a short random wait and finds the queue made.
 */
export async function makeQueue(boss: PgBoss, name: string): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    if (await boss.getQueue(name)) return;
    try {
      return await boss.createQueue(name);
    } catch (error) {
      if ((error as { code?: string }).code !== DEADLOCK || attempt === ATTEMPTS) throw error;
      await new Promise((resolve) => setTimeout(resolve, 20 + Math.random() * 40 * Math.min(attempt, 5)));
    }
  }
}
