import { invalidParam, missingParam, unknownParam } from "./api-error";

/**
 * A request's parameters as the SDK sends them: form fields with bracketed keys
 * (`metadata[deal_id]=…`, `expand[0]=customer`), already parsed into nested objects by qs.
 * Every value arrives as a string; these readers check and convert it, answering with the
 * provider's parameter errors.
 */
export type Metadata = Record<string, string>;

const INTEGER = /^-?\d+$/;
// The provider's documented metadata limits: 50 keys, key names up to 40 characters, values up to 500.
const METADATA_LIMITS = { keys: 50, keyLength: 40, valueLength: 500 };

export class Params {
  constructor(readonly raw: Record<string, unknown>) {}

  /** Refuses any parameter this endpoint does not take (`expand` is always taken). */
  only(allowed: readonly string[]): this {
    for (const key of Object.keys(this.raw)) {
      if (key !== "expand" && !allowed.includes(key)) throw unknownParam(key);
    }
    return this;
  }

  has(name: string): boolean {
    return this.raw[name] !== undefined;
  }

  string(name: string): string | undefined {
    const value = this.raw[name];
    if (value === undefined) return undefined;
    if (typeof value !== "string") throw invalidParam(name, `Invalid string: ${name} must be a string.`);
    return value;
  }

  requiredString(name: string): string {
    const value = this.string(name);
    if (value === undefined) throw missingParam(name);
    if (value === "") throw emptyString(name);
    return value;
  }

  /** An empty string unsets the field (null), as the provider's API does for optional text. */
  nullableString(name: string): string | null | undefined {
    const value = this.string(name);
    return value === "" ? null : value;
  }

  integer(name: string, bounds: { min?: number; max?: number } = {}): number | undefined {
    const value = this.string(name);
    if (value === undefined) return undefined;
    if (!INTEGER.test(value) || !Number.isSafeInteger(Number(value))) {
      throw invalidParam(name, `Invalid integer: ${value}`, "parameter_invalid_integer");
    }
    const number = Number(value);
    if (bounds.min !== undefined && number < bounds.min) throw invalidParam(name, `This value must be greater than or equal to ${bounds.min}.`);
    if (bounds.max !== undefined && number > bounds.max) throw invalidParam(name, `This value must be less than or equal to ${bounds.max}.`);
    return number;
  }

  boolean(name: string): boolean | undefined {
    const value = this.string(name);
    if (value === undefined) return undefined;
    if (value !== "true" && value !== "false") throw invalidParam(name, `Invalid boolean: ${value}`);
    return value === "true";
  }

  oneOf<T extends string>(name: string, choices: readonly T[]): T | undefined {
    const value = this.string(name);
    if (value === undefined) return undefined;
    if (!choices.includes(value as T)) throw invalidParam(name, `Invalid ${name}: must be one of ${listInWords(choices)}`);
    return value as T;
  }

  /** Form arrays arrive as `name[0]=…&name[1]=…`. */
  stringList(name: string): string[] | undefined {
    const value = this.raw[name];
    if (value === undefined) return undefined;
    const list = Array.isArray(value) ? value : typeof value === "object" && value !== null ? Object.values(value) : [value];
    if (!list.every((item) => typeof item === "string")) throw invalidParam(name, `Invalid array: ${name} must be a list of strings.`);
    return list as string[];
  }

  expand(): string[] {
    return this.stringList("expand") ?? [];
  }

  /**
   * Metadata as a patch on `current`: `metadata[key]=value` sets a key, `metadata[key]=` unsets
   * it, and `metadata=` clears them all.
   */
  metadata(current: Metadata = {}): Metadata {
    const value = this.raw.metadata;
    if (value === undefined) return current;
    if (value === "") return {};
    if (typeof value !== "object" || value === null || Array.isArray(value)) throw invalidParam("metadata", "Invalid metadata: must be a set of keys and string values.");
    const next: Metadata = { ...current };
    for (const [key, entry] of Object.entries(value)) {
      if (typeof entry !== "string") throw invalidParam(`metadata[${key}]`, `Invalid value for metadata[${key}]: must be a string.`);
      if (key.length > METADATA_LIMITS.keyLength) throw invalidParam(`metadata[${key}]`, `Metadata keys can have up to ${METADATA_LIMITS.keyLength} characters.`);
      if (entry.length > METADATA_LIMITS.valueLength) throw invalidParam(`metadata[${key}]`, `Metadata values can have up to ${METADATA_LIMITS.valueLength} characters.`);
      if (entry === "") delete next[key];
      else next[key] = entry;
    }
    if (Object.keys(next).length > METADATA_LIMITS.keys) throw invalidParam("metadata", `Metadata can have up to ${METADATA_LIMITS.keys} keys.`);
    return next;
  }
}

function emptyString(name: string) {
  return invalidParam(
    name,
    `You passed an empty string for '${name}'. We assume empty values are an attempt to unset a parameter; however '${name}' cannot be unset. You should remove '${name}' from your request or supply a non-empty value.`,
    "parameter_invalid_empty",
  );
}

function listInWords(choices: readonly string[]): string {
  if (choices.length < 3) return choices.join(" or ");
  return `${choices.slice(0, -1).join(", ")}, or ${choices.at(-1)}`;
}
