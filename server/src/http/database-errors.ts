import { ConflictError, DomainError, ValidationError } from '../errors';

/**
 * PostgreSQL errors that a client's input or a lost race causes, as the domain errors the API
 * answers with. Routes refuse bad input through the shared schemas first; this is the net below
 * them, so that no such case ever becomes a 500. Other database errors stay 500s.
 */
export function fromDatabaseError(err: unknown): DomainError | null {
  const code = (err as { code?: unknown })?.code;
  if (typeof code !== 'string' || !/^[0-9A-Z]{5}$/.test(code)) return null;
  switch (code) {
    case '23505': // unique_violation
      return new ConflictError('This already exists (it may just have been added by someone else)');
    case '40001': // serialization_failure
    case '40P01': // deadlock_detected
      return new ConflictError('Someone else changed this at the same moment; try again');
    case '22001': // string_data_right_truncation
    case '22003': // numeric_value_out_of_range
    case '22007': // invalid_datetime_format
    case '22008': // datetime_field_overflow
    case '22021': // character_not_in_repertoire (e.g. NUL)
    case '22P02': // invalid_text_representation
    case '22P05': // untranslatable_character
    case '54000': // program_limit_exceeded
      return new ValidationError('A value is outside what can be stored', []);
    default:
      return null;
  }
}
