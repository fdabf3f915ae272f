/**
 * The HTTP face of the pure engines (statistics, laminate, sections): routes
 * that validate, call an engine and shape the reply. Mounted under /api/v1
 * behind sign-in and CSRF protection by the app factory.
 */
import type { Router } from 'express';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { laminateOpenApi, laminateRouter } from './laminate.routes.ts';
import { sectionsOpenApi, sectionsRouter } from './sections.routes.ts';
import { statisticsOpenApi, statisticsRouter } from './statistics.routes.ts';

export const calculationRouters: Router[] = [statisticsRouter, laminateRouter, sectionsRouter];
export const calculationOpenApi: OpenApiFragment[] = [statisticsOpenApi, laminateOpenApi, sectionsOpenApi];
