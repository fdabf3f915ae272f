/**
 * HTTP face of the basis-value engine: POST /api/v1/statistics/basis takes
 * the same JSON as `plyledger basis` and returns the same result. The engine
 * validates (InputError → 400 with the field and the fix) and computes; this
 * route only passes the body through and sends the reply. Mounted under
 * /api/v1 behind sign-in and CSRF by the app factory; any signed-in user.
 */
import { Router } from 'express';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { BASIS_METHODS, MAX_VALUES } from '../statistics/index.ts';
import { runEngineJson, sendJsonText } from './engine-runner.ts';

export const statisticsRouter = Router();

statisticsRouter.post('/statistics/basis', async (req, res) => {
  sendJsonText(res, await runEngineJson('statistics.basis', req.body));
});

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const value = (description: string) => ({ type: ['number', 'null'], description });
const count = (description: string) => ({ type: 'integer', description });
const flag = (description: string) => ({ type: ['boolean', 'null'], description });
const text = (description: string) => ({ type: 'string', description });
const notes = (description: string) => ({ type: 'array', items: { type: 'string' }, description });
const unit = 'in the unit of the values';
const summaryProperties = {
  n: count('number of values analysed'),
  mean: value(unit),
  sd: value(`sample standard deviation, ${unit}`),
  cv: value('coefficient of variation, fraction (0.05 = 5 %)'),
  min: value(unit),
  max: value(unit),
};
const basisPair = {
  bBasis: value(`B-basis value, ${unit}; null when it does not exist or was not asked for`),
  aBasis: value(`A-basis value, ${unit}; null when it does not exist or was not asked for`),
};
const methodName = { type: 'string', enum: [...BASIS_METHODS, 'per-condition'] };

export const statisticsOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/statistics/basis': {
      post: {
        summary: 'A- and B-basis values of a data group',
        description:
          'Runs the decision flow of CMH-17-1G Vol. 1 chapter 8 on one data group (or several conditions): MNR outliers per batch and pooled, ' +
          'k-sample Anderson-Darling between batches (α = 0.025), Anderson-Darling fits with OSL for Weibull, normal and lognormal, basis values ' +
          'by each (exact noncentral-t factors; exact conditional Weibull limits beside the handbook approximation; ranks / Hanson-Koopmans), ' +
          'ANOVA for batches that may not be pooled, pooled SD and pooled CV across conditions with Levene\'s test, the modified CV method, ' +
          'and the provisional flag. Basis values are in the unit of the values (MPa for strengths in the internal units); CVs are fractions. ' +
          'A value that does not exist for the data is null, with a warning. Any signed-in user.',
        tags: ['statistics'],
        requestBody: { required: true, content: { 'application/json': { schema: ref('BasisRequest') } } },
        responses: {
          200: { description: `Computed; basis values ${unit}`, content: { 'application/json': { schema: ref('BasisResult') } } },
          400: { $ref: '#/components/responses/InvalidInput' },
          401: { $ref: '#/components/responses/Unauthenticated' },
        },
      },
    },
  },
  schemas: {
    BasisRequest: {
      type: 'object',
      required: ['values', 'batches'],
      additionalProperties: false,
      properties: {
        values: { type: 'array', minItems: 2, maxItems: MAX_VALUES, items: { type: 'number' }, description: 'measured values, one unit (e.g. MPa); finite numbers' },
        batches: { type: 'array', items: { type: ['string', 'number'] }, description: 'one batch label per value' },
        conditions: { type: 'array', items: { type: ['string', 'number'] }, description: 'optional: one condition (environment) label per value; runs the pooled methods and fills byCondition' },
        basis: { type: 'string', enum: ['A', 'B', 'both'], default: 'both' },
        method: { type: 'string', enum: ['auto', ...BASIS_METHODS], default: 'auto', description: 'anything but auto overrides the decision flow; the override is recorded with the diagnostics against it' },
        modifiedCv: { type: 'boolean', default: false, description: 'apply the modified CV method (CMH-17-1G Vol. 1 chapter 8)' },
        exclusions: {
          type: 'array',
          description: 'values set aside by the user, each with the reason recorded',
          items: { type: 'object', required: ['index', 'reason'], properties: { index: count('0-based position in values'), reason: text('why the value is excluded') } },
        },
      },
    },
    BasisOutlier: {
      type: 'object',
      properties: {
        index: count('0-based position in the request values'),
        value: value(unit),
        batch: text('batch label'),
        condition: text('condition label (with conditions)'),
        scope: { type: 'string', enum: ['batch', 'pooled', 'condition'] },
        statistic: value('maximum normed residual'),
        critical: value('MNR critical value at α = 0.05'),
      },
    },
    BasisBatchEquivalence: {
      type: 'object',
      description: 'k-sample Anderson-Darling test between batches (midrank form), α = 0.025',
      properties: {
        statistic: value('ADK = A²akN / (k - 1)'),
        critical: value('ADC'),
        pass: flag('true: batches may be pooled; null: not testable (see reason)'),
        a2akN: value('Scholz-Stephens statistic'),
        sigmaN: value('its standard deviation'),
        standardised: value('(A²akN - (k - 1)) / σN'),
        batches: count('number of batches'),
        alpha: { type: 'number' },
        reason: { type: ['string', 'null'] },
      },
    },
    BasisFits: {
      type: 'object',
      properties: {
        normal: { type: 'object', properties: { mean: value(unit), sd: value(unit), ad: value('Anderson-Darling statistic'), osl: value('observed significance level'), rejected: flag('OSL <= 0.05'), kB: value('tolerance factor'), kA: value('tolerance factor'), ...basisPair } },
        lognormal: { type: 'object', properties: { mu: value('mean of ln x'), sigma: value('SD of ln x'), ad: value(''), osl: value(''), rejected: flag(''), ...basisPair, reason: { type: ['string', 'null'] } } },
        weibull: {
          type: 'object',
          properties: {
            shape: value('maximum likelihood shape β'),
            scale: value(`maximum likelihood scale α, ${unit}`),
            ad: value(''),
            osl: value(''),
            rejected: flag(''),
            ...basisPair,
            bBasisApproximate: value('handbook closed-form approximation'),
            aBasisApproximate: value('handbook closed-form approximation'),
            reason: { type: ['string', 'null'] },
          },
        },
      },
    },
    BasisNonparametric: {
      type: 'object',
      properties: {
        method: { type: ['string', 'null'], enum: ['ranks', 'hanson-koopmans', 'ranks/hanson-koopmans', null], description: 'ranks/hanson-koopmans: B-basis by ranks (n >= 29), A-basis by Hanson-Koopmans (n < 299)' },
        ...basisPair,
        bMethod: { type: ['string', 'null'] },
        aMethod: { type: ['string', 'null'] },
        bOrder: { type: ['integer', 'null'], description: 'rank, or Hanson-Koopmans order statistic r' },
        aOrder: { type: ['integer', 'null'] },
        bK: value('Hanson-Koopmans exponent k'),
        aK: value('Hanson-Koopmans exponent k'),
        byRanks: { type: 'object', properties: basisPair },
        notes: notes('why a value by ranks does not exist'),
      },
    },
    BasisLevene: {
      type: 'object',
      description: "Levene's test, median-centred (Brown-Forsythe), α = 0.05",
      properties: { statistic: value('F'), pValue: value(''), critical: value('F critical'), df1: count(''), df2: count(''), pass: flag('equal variances may be assumed'), groups: text('batches or conditions'), on: text('values or normalised (x / condition mean)') },
    },
    BasisResult: {
      type: 'object',
      required: ['engineVersion', 'n', 'mean', 'sd', 'cv', 'method', 'bBasis', 'aBasis', 'provisional', 'warnings', 'outliers', 'batchEquivalence', 'fits', 'nonparametric'],
      properties: {
        engineVersion: text('version of the statistics engine that produced the result'),
        ...summaryProperties,
        basis: { type: 'string', enum: ['A', 'B', 'both'] },
        method: methodName,
        automaticMethod: methodName,
        decision: notes('steps of the decision flow with the numbers behind them'),
        ...basisPair,
        provisional: { type: 'boolean', description: 'B-basis from < 3 batches or < 18 values, or A-basis from < 5 batches or < 55 values' },
        provisionalDetail: { type: 'object', properties: { bBasis: { type: 'boolean' }, aBasis: { type: 'boolean' }, reasons: notes('') } },
        warnings: notes('values that do not exist, untested batches, flagged outliers, provisional status'),
        outliers: { type: 'array', items: ref('BasisOutlier') },
        outlierTests: { type: 'array', items: { type: 'object' }, description: 'every MNR test run: scope, batch, n, statistic, critical, outliers' },
        batchEquivalence: ref('BasisBatchEquivalence'),
        fits: { oneOf: [ref('BasisFits'), { type: 'null' }], description: 'null with conditions (each condition has its own in byCondition)' },
        nonparametric: { oneOf: [ref('BasisNonparametric'), { type: 'null' }] },
        anova: { type: 'object', properties: { ...basisPair, msBetween: value(`(${unit})²`), msWithin: value(`(${unit})²`), effectiveBatchSize: value("n'"), populationSd: value(unit), kB: value(''), kA: value(''), batches: count('') } },
        levene: ref('BasisLevene'),
        byBatch: { type: 'array', items: { type: 'object', properties: { batch: text(''), ...summaryProperties } } },
        byCondition: {
          type: 'object',
          description: 'with conditions: per condition label, its summary, the basis values of the method used (pooled or its own), its single-condition analysis and diagnostics',
          additionalProperties: { type: 'object', properties: { ...summaryProperties, method: methodName, ...basisPair, kB: value(''), kA: value(''), singlePoint: { type: 'object' }, batchEquivalence: ref('BasisBatchEquivalence'), fits: ref('BasisFits'), nonparametric: ref('BasisNonparametric'), provisional: { type: 'boolean' } } },
        },
        pooled: { type: 'object', description: 'with conditions: pooled SD and pooled CV estimates, normality of the pooled residuals, Levene on normalised values' },
        modifiedCv: { type: 'object', description: 'CV and CV* (fractions) and the modified-CV basis values' },
        override: { type: ['object', 'null'], properties: { requested: text(''), automatic: text(''), differs: { type: 'boolean' }, against: notes('diagnostics that argue against the requested method') } },
        excluded: { type: 'array', items: { type: 'object', properties: { index: count(''), value: value(unit), batch: text(''), reason: text('') } } },
      },
    },
  },
};
