import type { RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { type FieldIssue, ValidationError } from './errors';

export interface RequestSchemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

export type ValidatedInput<S extends RequestSchemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never;
};

const LOCATIONS = ['params', 'query', 'body'] as const;

/**
 * Validates the parts of the request that have a schema, all of them before failing, and answers
 * one 400 listing every issue. Parsed values go to `res.locals.input` (Express 5's req.query is a
 * getter and must not be assigned); read them with `inputOf(res, schemas)`.
 */
export function validate(schemas: RequestSchemas): RequestHandler {
  return (req, res, next) => {
    const input: Record<string, unknown> = {};
    const issues: FieldIssue[] = [];
    for (const location of LOCATIONS) {
      const schema = schemas[location];
      if (!schema) continue;
      const result = schema.safeParse(req[location], { reportInput: true });
      if (result.success) input[location] = result.data;
      else issues.push(...result.error.issues.map((issue) => toFieldIssue(location, issue)));
    }
    if (issues.length > 0) {
      const summary = issues.map((i) => (i.field ? `${i.field}: ${i.message}` : i.message)).join('; ');
      next(new ValidationError(`Please correct the request: ${summary}.`, { details: issues }));
      return;
    }
    res.locals.input = input;
    next();
  };
}

/** The values `validate(schemas)` parsed, typed by the same schemas object. */
export function inputOf<S extends RequestSchemas>(res: Response, _schemas: S): ValidatedInput<S> {
  return res.locals.input as ValidatedInput<S>;
}

function toFieldIssue(location: FieldIssue['location'], issue: z.core.$ZodIssue): FieldIssue {
  const missing = issue.code === 'invalid_type' && 'input' in issue && issue.input === undefined;
  const field = issue.path.map(String).join('.');
  if (missing && field === '' && location === 'body') {
    return { location, field, message: 'a JSON body is required' };
  }
  return { location, field, message: missing ? 'is required' : issue.message };
}
