import { HttpInterceptorFn } from '@angular/common/http';
import { apiErrorInterceptor } from './api-error.interceptor';
import { csrfInterceptor } from './csrf.interceptor';
import { requestProgressInterceptor } from './request-progress';

/**
 * Outermost first: progress sees every request; the CSRF retry happens inside, before failures
 * are turned into ApiErrors.
 */
export const apiInterceptors: HttpInterceptorFn[] = [requestProgressInterceptor, apiErrorInterceptor, csrfInterceptor];
