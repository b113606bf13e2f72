/**
 * The domain's errors: what the data layer (db/queries) and the rules
 * (lib/workflow.ts) throw when a request cannot be carried out. They say
 * what went wrong in the domain's words and never carry an HTTP status; the
 * route layer (lib/http/errors.ts, errorResponse) maps each class to one
 * status in one place: not found → 404, conflict → 409, rule broken → 422,
 * expired → 410. Framework-free: no next, no Response, no database.
 */

/** One problem with one field: the field's dotted path and a plain message. */
export interface FieldProblem {
  field: string;
  message: string;
}

/** The common base: a machine-readable `code`, a plain message, and the fields it is about. */
export abstract class DomainError extends Error {
  /** The issues keyed by field (the first message of each field), or undefined when there are none. */
  readonly fields?: Record<string, string>;

  constructor(
    readonly code: string,
    message: string,
    /** The fields the error is about, each with its message; empty when it is about the request as a whole. */
    readonly issues: readonly FieldProblem[] = [],
  ) {
    super(message);
    if (issues.length > 0) {
      const fields: Record<string, string> = {};
      for (const i of issues) fields[i.field] ??= i.message;
      this.fields = fields;
    }
  }
}

const issuesOf = (message: string, field?: string, issues?: readonly FieldProblem[]): FieldProblem[] => {
  const list = [...(issues ?? [])];
  if (field && !list.some((i) => i.field === field)) list.unshift({ field, message });
  return list;
};

/**
 * A record that does not exist, or that the caller may not see (another
 * team's ids, unreleased work for production): both answer the same.
 *
 * @example
 * ```ts
 * throw new NotFoundError("batch record"); // "No such batch record."
 * ```
 */
export class NotFoundError extends DomainError {
  constructor(what = "record", message = `No such ${what}.`) {
    super("not_found", message);
    this.name = "NotFoundError";
  }
}

/**
 * The request clashes with the record's present state: a stale save, a
 * closed batch record, a name already taken, the team's last admin.
 *
 * @example
 * ```ts
 * throw new ConflictError("conflict", "This batch record is closed and can no longer change.");
 * ```
 */
export class ConflictError extends DomainError {
  constructor(code: string, message: string, field?: string) {
    super(code, message, issuesOf(message, field));
    this.name = "ConflictError";
  }
}

/**
 * A business rule the request breaks: missing weighings before closing a
 * batch, an import that still has errors, a review comment that is required.
 *
 * @example
 * ```ts
 * throw new RuleError("incomplete", "The batch cannot be closed yet.", undefined, [{ field: "lines.0.actualGrams", message: "No actual mass." }]);
 * ```
 */
export class RuleError extends DomainError {
  constructor(code: string, message: string, field?: string, issues?: readonly FieldProblem[]) {
    super(code, message, issuesOf(message, field, issues));
    this.name = "RuleError";
  }
}

/**
 * The person may hold the right role but may not do this to this record
 * (separation of duties: nobody disposes a batch they made). Mapped to 403.
 */
export class SeparationError extends DomainError {
  constructor(code: string, message: string) {
    super(code, message);
    this.name = "SeparationError";
  }
}

/** Something that was kept for a while and is gone now (an import preview past its time). */
export class ExpiredError extends DomainError {
  constructor(message: string) {
    super("expired", message);
    this.name = "ExpiredError";
  }
}
