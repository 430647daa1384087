import type { Response } from 'express';

/**
 * An answer whose JSON is already written as text (by PostgreSQL, for the busiest lists), sent as
 * it is instead of being parsed into objects and written again. `T` is the shape the text holds
 * (a shared schema's type): the API tests parse such answers with that schema.
 */
export class JsonText<T> {
  /** Only for the type checker: the shape of the JSON in `text`. */
  declare readonly shape?: T;
  constructor(readonly text: string) {}
}

/** Sends `body` as res.json would send its object (same content type). */
export function sendJsonText(res: Response, body: JsonText<unknown>): void {
  res.type('application/json').send(body.text);
}
