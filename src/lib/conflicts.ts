import { useState } from "react";
import { ApiError } from "./api-client";

/**
 * Every record two people can edit at once carries a version, and a save sends the version its form
 * opened with. When someone else saved first, the server answers 409 with the record as it is now
 * (`current`): the form shows their version with the server's words, and the person makes their
 * change again if it still applies (the board's pattern, shared by every form).
 */
export function staleRecord<T>(error: unknown): { message: string; current: T } | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const current = (error.body as { current?: T } | null)?.current;
  return current === undefined ? null : { message: error.message, current };
}

/** The fields of `now` whose values differ from those the form opened with: a save sends only what its editor changed. */
export function changedFields<T extends Record<string, unknown>>(opened: Record<string, unknown>, now: T): Partial<T> {
  const changed: Partial<T> = {};
  for (const key of Object.keys(now) as (keyof T & string)[]) {
    if (JSON.stringify(now[key]) !== JSON.stringify(opened[key])) changed[key] = now[key];
  }
  return changed;
}

export interface OpenedRecord<T, Opened> {
  opened: Opened;
  /** The version a save sends: the opened record's, 0 for a new one. */
  version: number;
  /** Start over from this record: the form opens again, or a save landed. */
  startFrom(current: T): void;
  /** A failed save's message when someone else saved first (the form now shows their version); null for any other failure. */
  conflictIn(error: unknown): string | null;
}

/**
 * The record a form opened with (null while it makes a new one), whose version its save sends. `show`
 * puts a record's values in the form: when it opens again, when a save lands, and when a save was
 * stale (`conflictIn`).
 */
export function useOpenedRecord<T extends { version: number }>(record: T, show: (current: T) => void): OpenedRecord<T, T>;
export function useOpenedRecord<T extends { version: number }>(record: T | null, show: (current: T) => void): OpenedRecord<T, T | null>;
export function useOpenedRecord<T extends { version: number }>(record: T | null, show: (current: T) => void): OpenedRecord<T, T | null> {
  const [opened, setOpened] = useState(record);
  const startFrom = (current: T) => {
    setOpened(current);
    show(current);
  };
  return {
    opened,
    version: opened?.version ?? 0,
    startFrom,
    conflictIn(error) {
      const stale = staleRecord<T>(error);
      if (!stale) return null;
      startFrom(stale.current);
      return stale.message;
    },
  };
}
