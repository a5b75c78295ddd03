import { BadRequestException, ValidationError, ValidationPipe } from '@nestjs/common';
import type { FieldProblem } from '@cribra/contracts';

function flatten(errors: ValidationError[], prefix = ''): FieldProblem[] {
  return errors.flatMap((e) => {
    const field = prefix ? `${prefix}.${e.property}` : e.property;
    const own: FieldProblem[] = e.constraints ? [{ field, messages: Object.values(e.constraints) }] : [];
    return [...own, ...flatten(e.children ?? [], field)];
  });
}

/** 400 with `details` listing each field and its messages. */
export function validationException(errors: ValidationError[]): BadRequestException {
  const details = flatten(errors);
  const message = details.length ? details.map((d) => d.messages[0]).join('; ') : 'The request is not valid';
  return new BadRequestException({ message, error: 'Bad Request', details });
}

/** The global pipe: whitelist DTO fields, reject unknown ones, convert types, uniform 400s. */
export function createValidationPipe(): ValidationPipe {
  return new ValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    exceptionFactory: validationException,
  });
}
