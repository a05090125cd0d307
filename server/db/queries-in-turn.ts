import type pg from "pg";

/**
 * Sends a connection's queries one after another, each once the one before it has answered. Services
 * start reads side by side (`Promise.all`) on whatever they are handed, and a transaction holds one
 * connection: pg queues such queries itself today but deprecates it ("Calling client.query() when the
 * client is already executing a query", to be removed in pg 9). Queries given a callback (the pool's
 * own `pool.query`, which gets a free connection) or sent as a submittable (a cursor) go as they come.
 */
export function queriesInTurn(client: pg.ClientBase): void {
  const send = client.query.bind(client) as (...args: unknown[]) => Promise<unknown>;
  let last: Promise<unknown> = Promise.resolve();
  let waiting = 0;
  client.query = ((...args: unknown[]) => {
    if (!answersWithPromise(args)) return send(...args);
    const start = () => send(...args);
    const answer = waiting === 0 ? start() : last.then(start, start);
    waiting++;
    const settle = () => {
      waiting--;
    };
    last = answer.then(settle, settle);
    return answer;
  }) as unknown as pg.ClientBase["query"];
}

function answersWithPromise(args: unknown[]): boolean {
  if (typeof args[args.length - 1] === "function") return false;
  const config = args[0] as { submit?: unknown; callback?: unknown } | null;
  return !(config && typeof config === "object" && (typeof config.submit === "function" || typeof config.callback === "function"));
}
