import { ErrorHandler, Injectable } from '@angular/core';
import { ApiError } from './api-error';

/**
 * Last stop for errors nobody handled. It only reports them; what the user sees is decided where
 * each call is made.
 */
@Injectable()
export class ErrorReporter implements ErrorHandler {
  handleError(error: unknown): void {
    if (error instanceof ApiError) {
      console.error(`Taulens: unhandled API error ${error.status} ${error.code}: ${error.message}`);
      return;
    }
    console.error('Taulens: unexpected error', error);
  }
}
