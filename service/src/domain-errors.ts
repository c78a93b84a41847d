/**
 * What the repositories and the rest of the data layer refuse, in domain terms. Nothing here knows
 * of HTTP: the error handler (`http/error-handler.ts`) is the one place that turns each kind into a
 * status and a code of the API's error shape.
 */

/** Where in the request a problem lies (a field path such as `spaces.3.area`) and what it is. */
export interface ErrorDetail {
  path: string;
  message: string;
}

/** Every refusal: a message people read and, where it concerns fields, one detail per field. */
export abstract class DomainError extends Error {
  constructor(
    message: string,
    readonly details: ErrorDetail[] = [],
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** The thing asked for does not exist (or not in this project). */
export class NotFound extends DomainError {}

/** The values given cannot be taken as they are: a limit, a range or a reference the data does not hold. */
export class Refused extends DomainError {}

/** The write would clash with what is stored: a tag or an entry the project already has, a rule of the team. */
export class Conflict extends DomainError {}

/** The row changed since the writer read it; the write was not applied. */
export class Stale extends Conflict {
  constructor(
    message: string,
    /** The row's version now, which the writer's copy no longer matches. */
    readonly currentVersion: number | null,
    details: ErrorDetail[] = [],
  ) {
    super(message, details);
  }
}

/** A thing other rows still count on, so it cannot go. */
export class InUse extends Conflict {}

/** A deleted thing that cannot come back as it was; the message says why. */
export class NotRestorable extends DomainError {
  constructor(readonly reason: string) {
    super(reason);
  }
}

/** The project is archived, so it is read-only. */
export class Archived extends DomainError {}

/** The design is under review, accepted or issued: it changes only in a draft or after it is returned. */
export class Locked extends DomainError {}

/** An import key sent again with another import. */
export class KeyReused extends DomainError {}

/** A service the write depends on (the file store) did not answer; nothing was recorded. */
export class Unavailable extends DomainError {
  constructor(message: string, cause?: unknown) {
    super(message);
    this.cause = cause;
  }
}
