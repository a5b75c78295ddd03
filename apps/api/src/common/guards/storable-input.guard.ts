import { BadRequestException, type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import type { Request } from 'express';
import type { FieldProblem } from '@cribra/contracts';

// PostgreSQL cannot store U+0000 in text, nor an unpaired UTF-16 surrogate in json/jsonb
// (`"\ud800"` is "invalid input syntax for type json"), and class-transformer throws a TypeError on
// a nested object with an own `constructor` key: such input used to come back as a 500. It is
// refused here with a 400 naming the field, before any guard, pipe, DTO or service sees it (a global
// guard, because route guards such as sign-in read the body before the pipes run).
const UNSTORABLE = /\u0000|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
const MAX_DEPTH = 64;

function problems(value: unknown, field: string, out: FieldProblem[], depth = 0): void {
  if (out.length >= 20) return;
  if (depth > MAX_DEPTH) {
    out.push({ field, messages: [`${field} nests deeper than ${MAX_DEPTH} levels`] });
    return;
  }
  if (typeof value === 'string') {
    if (UNSTORABLE.test(value)) out.push({ field, messages: [`${field} contains a NUL character or an unpaired surrogate, which cannot be stored`] });
    return;
  }
  if (Array.isArray(value)) {
    value.forEach((v, i) => problems(v, `${field}[${i}]`, out, depth + 1));
    return;
  }
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const name = field ? `${field}.${k}` : k;
      if (FORBIDDEN_KEYS.has(k) || UNSTORABLE.test(k)) out.push({ field: name, messages: [`${JSON.stringify(k)} is not allowed as a field name`] });
      else problems(v, name, out, depth + 1);
    }
  }
}

/** Global guard: 400 for body, query or path input that cannot be validated or stored safely. */
@Injectable()
export class StorableInputGuard implements CanActivate {
  canActivate(context: ExecutionContext): boolean {
    if (context.getType() !== 'http') return true;
    const req = context.switchToHttp().getRequest<Request>();
    const details: FieldProblem[] = [];
    for (const [part, value] of [['body', req.body], ['query', req.query], ['path', req.params]] as const) {
      const before = details.length;
      problems(value, '', details);
      for (const d of details.slice(before)) d.field = d.field ? d.field : part;
    }
    if (details.length) throw new BadRequestException({ message: details[0]!.messages[0], error: 'Bad Request', details });
    return true;
  }
}
