import type { ApiErrorDetail } from '@cc/shared';

/** Errors that services throw; they know nothing of HTTP. The error handler maps them to statuses. */
export class DomainError extends Error {
  constructor(
    message: string,
    readonly details: ApiErrorDetail[] = [],
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** No such record, or the user is not a party to it (existence is never disclosed). */
export class NotFoundError extends DomainError {}
/** Signed in, but this role may not do this. */
export class ForbiddenError extends DomainError {}
/** Not signed in. */
export class UnauthenticatedError extends DomainError {}
/** The record changed meanwhile, or is in a state that does not allow this. */
export class ConflictError extends DomainError {}
/** Input is well-formed but its content cannot be processed (e.g. a PDF without text). */
export class UnprocessableError extends DomainError {}
/** Input breaks a rule of the domain; like a zod 400, with field details. */
export class ValidationError extends DomainError {}
/** Upload or body larger than allowed. */
export class TooLargeError extends DomainError {}
/** The upload is not of a kind the endpoint takes. */
export class UnsupportedTypeError extends DomainError {}
