import { provideHttpClient, withInterceptors } from '@angular/common/http';
import {
  ErrorHandler,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { bootstrapApplication } from '@angular/platform-browser';
import { provideRouter, TitleStrategy, withComponentInputBinding, withRouterConfig } from '@angular/router';
import { App } from './app/app';
import { appRoutes } from './app/app.routes';
import { apiInterceptors } from './app/core/api-interceptors';
import { ErrorReporter } from './app/core/error-reporter';
import { PageTitle } from './app/core/page-title';

bootstrapApplication(App, {
  providers: [
    provideZonelessChangeDetection(),
    // Sends window errors and unhandled rejections to the ErrorHandler below.
    provideBrowserGlobalErrorListeners(),
    { provide: ErrorHandler, useClass: ErrorReporter },
    provideRouter(
      appRoutes,
      // Route parameters reach components as inputs...
      withComponentInputBinding(),
      // ...including :projectId in the pages nested under the project shell.
      withRouterConfig({ paramsInheritanceStrategy: 'always' }),
    ),
    { provide: TitleStrategy, useClass: PageTitle },
    provideHttpClient(withInterceptors(apiInterceptors)),
    provideAppInitializer(() => {
      // Icons come from the Material Symbols Outlined font shipped in fonts/.
      inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
    }),
  ],
}).catch((error: unknown) => console.error('Taulens could not start', error));
