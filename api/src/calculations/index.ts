/**
 * The HTTP face of the pure engines (statistics, laminate, sections): routes
 * that validate, call an engine and shape the reply. Mounted under /api/v1
 * behind sign-in and CSRF protection by the app factory.
 */
import type { Router } from 'express';
import type { OpenApiFragment } from '../http/openapi-types.ts';

export const calculationRouters: Router[] = [];
export const calculationOpenApi: OpenApiFragment[] = [];
