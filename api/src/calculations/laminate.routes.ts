/**
 * HTTP face of the laminate engine: analysis, failure envelope and polar data.
 * Validation and mathematics live in api/src/laminate; these routes pass the
 * body through the engine's parser, call it and send the result. Mounted under
 * /api/v1 behind sign-in and CSRF by the app factory; any signed-in user.
 */
import { Router } from 'express';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { CRITERIA } from '../laminate/index.ts';
import { runEngineJson, sendJsonText } from './engine-runner.ts';

export const laminateRouter = Router();

laminateRouter.post('/laminates/analyze', async (req, res) => {
  sendJsonText(res, await runEngineJson('laminate.analyse', req.body));
});

laminateRouter.post('/laminates/envelope', async (req, res) => {
  sendJsonText(res, await runEngineJson('laminate.envelope', req.body));
});

laminateRouter.post('/laminates/polar', async (req, res) => {
  sendJsonText(res, await runEngineJson('laminate.polar', req.body));
});

const num = (description: string) => ({ type: 'number', description });
const triple = (description: string, nullable = false) => ({
  type: 'array', minItems: 3, maxItems: 3, description, items: nullable ? { type: ['number', 'null'] } : { type: 'number' },
});
const matrix = (size: number, description: string) => ({
  type: 'array', description: `${description}; array of ${size} rows`, items: { type: 'array', minItems: size, maxItems: size, items: { type: 'number' } },
});
const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const criterionName = { type: 'string', enum: [...CRITERIA] };
const stackProperties = {
  plies: { type: 'array', minItems: 1, maxItems: 2000, items: ref('LaminatePly'), description: 'stacking order, first ply at the bottom (z = -h/2)' },
  code: { type: 'string', description: 'laminate code instead of plies, e.g. "[0/±45/90]2s", "[(0/90)2/45*]s", "[0/45]T"' },
  material: ref('LaminatePlyMaterial'),
  plyThickness: num('mm, thickness of every ply of the code'),
};
const failureSettings = {
  tsaiWu: { type: 'object', properties: { F12Star: num('normalised interaction, F12 = F12* sqrt(F11 F22); in (-1, 1), default -0.5') } },
  puck: {
    type: 'object',
    properties: {
      pPerpParTension: num('p⊥∥(+), default 0.35 (carbon/epoxy)'),
      pPerpParCompression: num('p⊥∥(-), default 0.30 (carbon/epoxy)'),
      pPerpPerpCompression: num('p⊥⊥(-); default derived from p⊥∥(-), Yc and S12'),
    },
  },
};
const surface = {
  type: 'object',
  properties: {
    strainLaminate: triple('[εx, εy, γxy], total strain, dimensionless (engineering shear)'),
    stressLaminate: triple('[σx, σy, τxy], MPa'),
    strainPly: triple('[ε1, ε2, γ12], total strain in ply axes'),
    stressPly: triple('[σ1, σ2, τ12], MPa'),
  },
};
const problemsResponse = { $ref: '#/components/responses/InvalidInput' };
const unauthenticated = { $ref: '#/components/responses/Unauthenticated' };
const operation = (summary: string, description: string, input: string, output: string) => ({
  post: {
    summary, description, tags: ['laminates'],
    requestBody: { required: true, content: { 'application/json': { schema: ref(input) } } },
    responses: {
      200: { description: 'Computed; internal units (mm, N, MPa, N/mm, N·mm/mm, °C)', content: { 'application/json': { schema: ref(output) } } },
      400: problemsResponse,
      401: unauthenticated,
    },
  },
});

export const laminateOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/laminates/analyze': operation(
      'Analyse a laminate',
      'A, B, D, H, ABD and abd; membrane and flexural constants; CTE; mid-plane and ply strains and stresses under loads, ΔT and Δm; failure index, strength ratio and mode per criterion and ply; first-ply failure with margin of safety; optional ply-discount progression; design-rule checks. Errors name the ply and field.',
      'LaminateInput', 'LaminateAnalysis'),
    '/api/v1/laminates/envelope': operation(
      'First-ply failure envelope',
      'For each load direction in (Nx, Ny) or (Nx, Nxy), the line load at first-ply failure by one criterion, residual stress held fixed; also divided by the thickness (laminate stress space).',
      'LaminateEnvelopeInput', 'LaminateEnvelope'),
    '/api/v1/laminates/polar': operation(
      'Polar stiffness',
      'Ex, Ey, Gxy, nu_xy (membrane) and the flexural set of the laminate turned from 0 to 180°.',
      'LaminatePolarInput', 'LaminatePolar'),
  },
  schemas: {
    LaminatePlyMaterial: {
      type: 'object', required: ['E1', 'E2', 'G12', 'nu12'],
      description: 'orthotropic ply; moduli and strengths in MPa, compressive strengths as positive magnitudes',
      properties: {
        name: { type: 'string' }, E1: num('MPa, > 0'), E2: num('MPa, > 0'), G12: num('MPa, > 0'), nu12: num('major Poisson ratio, |nu12| < sqrt(E1/E2)'),
        G13: num('MPa; default G12'), G23: num('MPa; default G13'), density: num('kg/m³'),
        alpha1: num('1/°C'), alpha2: num('1/°C'), beta1: num('per unit moisture mass fraction'), beta2: num('per unit moisture mass fraction'),
        Xt: num('MPa'), Xc: num('MPa, magnitude'), Yt: num('MPa'), Yc: num('MPa, magnitude'), S12: num('MPa'), S23: num('MPa, Hashin matrix compression; default Yc/2'),
        e1t: num('strain allowable; default Xt/E1'), e1c: num('magnitude; default Xc/E1'), e2t: num('default Yt/E2'), e2c: num('magnitude; default Yc/E2'), g12: num('engineering shear strain; default S12/G12'),
      },
    },
    LaminatePly: { type: 'object', required: ['material', 'thetaDeg', 'thickness'], properties: { material: ref('LaminatePlyMaterial'), thetaDeg: num('degrees, counter-clockwise from x to the fibre'), thickness: num('mm, > 0') } },
    LaminateInput: {
      type: 'object', description: 'either plies, or code + material + plyThickness',
      properties: {
        ...stackProperties,
        loads: {
          type: 'object',
          properties: {
            N: triple('[Nx, Ny, Nxy], N/mm; null where the strain is prescribed', true),
            M: triple('[Mx, My, Mxy], N·mm/mm; null where the curvature is prescribed', true),
            deltaT: num('°C from the stress-free temperature (negative after cure)'),
            deltaMoisture: num('moisture mass fraction'),
            midplaneStrain: triple('prescribed [εx, εy, γxy], null where the load is given (mixed input)', true),
            curvature: triple('prescribed [κx, κy, κxy] in 1/mm, null where the moment is given', true),
          },
        },
        criteria: { type: 'array', items: criterionName, description: 'default with loads: every criterion the strengths support' },
        factorOfSafety: num('> 0, default 1; margin of safety = strength ratio / factorOfSafety - 1'),
        ...failureSettings,
        transverseShear: { type: 'object', properties: { model: { type: 'string', enum: ['correction-factor', 'parabolic'] }, correctionFactor: num('default 5/6') } },
        progressive: { type: 'boolean', description: 'ply-discount progressive failure to last-ply failure' },
      },
    },
    LaminateAnalysis: {
      type: 'object',
      required: ['thickness', 'arealMass', 'A', 'B', 'D', 'H', 'abd', 'ABD', 'membrane', 'flexural', 'plies', 'rules'],
      properties: {
        engineVersion: { type: 'string' }, thickness: num('mm'), arealMass: num('kg/m²'),
        A: matrix(3, 'N/mm'), B: matrix(3, 'N'), D: matrix(3, 'N·mm'), H: matrix(2, '[[A44, A45], [A45, A55]], N/mm (4 = yz, 5 = xz)'),
        ABD: matrix(6, '[[A, B], [B, D]]'), abd: matrix(6, 'inverse of ABD'),
        transverseShear: { type: 'object', description: 'shear model of H (correction factor 5/6 by default) and defaults taken' },
        membrane: { type: 'object', description: 'MPa, from the full abd', properties: { Ex: num('MPa'), Ey: num('MPa'), Gxy: num('MPa'), nuxy: num(''), nuyx: num(''), etaxs: num('a16/a11'), etays: num('a26/a22') } },
        flexural: { type: 'object', description: 'MPa, 12/(h³ d_ii)', properties: { Ex: num('MPa'), Ey: num('MPa'), Gxy: num('MPa'), nuxy: num('') } },
        cte: { type: ['object', 'null'], description: 'strain per °C and curvature per mm per °C of the free laminate' },
        midplane: { type: 'object', properties: { strain: triple('[εx0, εy0, γxy0]'), curvature: triple('[κx, κy, κxy], 1/mm') } },
        plies: {
          type: 'array',
          items: {
            type: 'object',
            properties: {
              index: { type: 'integer', description: '0-based, as plies[i] of the input' }, thetaDeg: num('degrees'), zBottom: num('mm'), zTop: num('mm'),
              bottom: surface, top: surface,
              failure: { type: 'object', description: 'per criterion: { index (1 at failure), strengthRatio (null if never), mode, surface }' },
            },
          },
        },
        firstPlyFailure: { type: 'object', description: 'per criterion: { ply, surface, strengthRatio, mode, marginOfSafety, failureLoads }' },
        progressive: { type: 'object', description: 'per criterion: { events: [{ step, loadFactor, ply, surface, mode, plyState }], lastPlyFailure, endedBy }' },
        rules: { type: 'array', items: { type: 'object', properties: { rule: { type: 'string' }, pass: { type: 'boolean' }, detail: { type: 'string' } } } },
        notes: { type: 'array', items: { type: 'string' } },
      },
    },
    LaminateEnvelopeInput: {
      type: 'object',
      properties: {
        ...stackProperties, criterion: criterionName, axes: { type: 'string', enum: ['Nx-Ny', 'Nx-Nxy'] },
        points: { type: 'integer', minimum: 4, maximum: 3600, description: 'load directions over 360°, default 360' },
        deltaT: num('°C, residual stress held fixed'), deltaMoisture: num('mass fraction'), ...failureSettings,
      },
    },
    LaminateEnvelope: {
      type: 'object',
      properties: {
        criterion: criterionName, axes: { type: 'string' }, thickness: num('mm'),
        points: {
          type: 'array',
          items: {
            type: 'object',
            properties: {
              angleDeg: num('load direction'), strengthRatio: { type: ['number', 'null'] },
              N: { type: ['array', 'null'], items: { type: 'number' }, description: '[Nx, Ny] or [Nx, Nxy] at first-ply failure, N/mm' },
              stress: { type: ['array', 'null'], items: { type: 'number' }, description: 'the same divided by the thickness, MPa' },
              ply: { type: ['integer', 'null'] }, surface: { type: ['string', 'null'] }, mode: { type: ['string', 'null'] },
            },
          },
        },
      },
    },
    LaminatePolarInput: { type: 'object', properties: { ...stackProperties, stepDeg: num('degrees, default 1') } },
    LaminatePolar: {
      type: 'object',
      properties: {
        stepDeg: num('degrees'),
        points: { type: 'array', items: { type: 'object', properties: { angleDeg: num('degrees'), Ex: num('MPa'), Ey: num('MPa'), Gxy: num('MPa'), nuxy: num(''), flexural: { type: 'object' } } } },
      },
    },
  },
};
