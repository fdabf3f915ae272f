import { expect } from 'chai';
import { analyseLaminate, CRITERIA, parseLaminateInput, type PlyInput } from '../../api/src/laminate/index.ts';
import { DEMO_CARBON, randomAngle, randomMaterial, seededRandom, T300_5208 } from './support/generators.ts';

describe('laminate engine: first-ply and progressive failure', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('loads times the first-ply strength ratio put the critical ply on index 1 and no ply above it (every criterion; 60 stacks with ΔT)', () => {
    const rnd = seededRandom(701);
    for (let k = 0; k < 60; k++) {
      const m = randomMaterial(rnd);
      const plies: PlyInput[] = Array.from({ length: 2 + Math.floor(rnd() * 10) }, () => ({ material: m, thetaDeg: randomAngle(rnd), thickness: 0.1 + 0.2 * rnd() }));
      const N = [0, 1, 2].map(() => -100 + 200 * rnd()), M = [0, 1, 2].map(() => -5 + 10 * rnd());
      const deltaT = -120 * rnd();
      const first = analyseLaminate(parseLaminateInput({ plies, loads: { N, M, deltaT }, criteria: [...CRITERIA] }));
      for (const c of CRITERIA) {
        const f = first.firstPlyFailure![c]!;
        if (f.strengthRatio === 0) continue; // the cool-down alone fails a ply
        const R = f.strengthRatio!;
        expect(f.marginOfSafety).to.be.closeTo(R - 1, 1e-12);
        expect(f.failureLoads!.N[0]).to.be.closeTo(R * N[0], 1e-9 * Math.abs(R * N[0]) + 1e-12);
        const atFailure = analyseLaminate(parseLaminateInput({ plies, loads: { N: N.map((v) => v * R), M: M.map((v) => v * R), deltaT }, criteria: [c] }));
        const critical = atFailure.plies[f.ply!].failure![c]!.index;
        const jump = c === 'hashin' && critical > 1 + 1e-9; // Hashin's fibre modes jump where σ1 changes sign under shear (Hashin 1980)
        if (!jump) expect(critical, `${c} stack ${k}`).to.be.closeTo(1, 1e-9);
        for (const p of atFailure.plies) if (!jump) expect(p.failure![c]!.index).to.be.at.most(1 + 1e-9);
      }
    }
  });

  it('margin of safety = strength ratio / factor of safety - 1 (ENGINEERING.md section 3 item 5)', () => {
    const base = { code: '[0/±45/90]s', material: DEMO_CARBON, plyThickness: 0.125, loads: { N: [300, 0, 0] }, criteria: ['tsai-wu'] };
    const one = analyseLaminate(parseLaminateInput(base)).firstPlyFailure!['tsai-wu']!;
    const fos = analyseLaminate(parseLaminateInput({ ...base, factorOfSafety: 1.5 })).firstPlyFailure!['tsai-wu']!;
    expect(fos.strengthRatio).to.equal(one.strengthRatio);
    expect(fos.marginOfSafety).to.be.closeTo(one.strengthRatio! / 1.5 - 1, 1e-12);
  });

  it('a unidirectional laminate pulled along the fibres: every ply breaks at Xt·h, last-ply = first-ply failure', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[0_4]T', material: DEMO_CARBON, plyThickness: 0.25, loads: { N: [1, 0, 0] }, criteria: ['max-stress', 'puck'], progressive: true }));
    for (const c of ['max-stress', 'puck'] as const) {
      const p = a.progressive![c]!;
      expect(p.events.map((e) => e.plyState)).to.deep.equal(['fibre-failed', 'fibre-failed', 'fibre-failed', 'fibre-failed']);
      expect(p.endedBy).to.equal('all-plies-failed');
      expect(p.lastPlyFailure!.loadFactor).to.be.closeTo(DEMO_CARBON.Xt!, 1e-9 * DEMO_CARBON.Xt!);
    }
  });

  it('a unidirectional laminate pulled across the fibres: the cracks cascade through all plies at Yt·h, then the load path is lost', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[0_4]T', material: DEMO_CARBON, plyThickness: 0.25, loads: { N: [0, 1, 0] }, criteria: ['tsai-wu'], progressive: true }));
    const p = a.progressive!['tsai-wu']!;
    expect(p.events.map((e) => e.plyState)).to.deep.equal(['matrix-failed', 'matrix-failed', 'matrix-failed', 'matrix-failed']);
    for (const e of p.events) expect(e.loadFactor).to.be.closeTo(DEMO_CARBON.Yt!, 1e-9 * DEMO_CARBON.Yt!);
    expect(p.endedBy).to.equal('load-path-lost');
    expect(p.lastPlyFailure!.loadFactor).to.be.closeTo(DEMO_CARBON.Yt!, 1e-9 * DEMO_CARBON.Yt!);
  });

  it('[0/90]s in tension: 90° plies crack first; the next failure load equals the first-ply failure of the hand-degraded laminate (ply-discount; independent path)', () => {
    const loads = { N: [1, 0, 0], deltaT: -100 };
    const a = analyseLaminate(parseLaminateInput({ code: '[0/90]s', material: T300_5208, plyThickness: 0.125, loads, criteria: ['max-stress'], progressive: true }));
    const p = a.progressive!['max-stress']!;
    expect(p.events[0].loadFactor).to.equal(a.firstPlyFailure!['max-stress']!.strengthRatio);
    expect([p.events[0].ply, p.events[1].ply].sort()).to.deep.equal([1, 2]);
    expect(p.events[0].plyState).to.equal('matrix-failed');
    // the laminate after both 90° plies are discounted, built by hand: E2 and G12 of those plies times 1e-6
    const cracked = { ...T300_5208, E2: T300_5208.E2 * 1e-6, G12: T300_5208.G12 * 1e-6 };
    const plies: PlyInput[] = [0, 90, 90, 0].map((thetaDeg, i) => ({ material: i === 1 || i === 2 ? cracked : T300_5208, thetaDeg, thickness: 0.125 }));
    const degraded = analyseLaminate(parseLaminateInput({ plies, loads, criteria: ['max-stress'] }));
    const zeroPlies = Math.min(degraded.plies[0].failure!['max-stress']!.strengthRatio!, degraded.plies[3].failure!['max-stress']!.strengthRatio!);
    expect(p.events[2].loadFactor).to.be.closeTo(Math.max(p.events[1].loadFactor, zeroPlies), 1e-9 * zeroPlies);
    expect(p.lastPlyFailure!.loadFactor).to.be.greaterThan(p.events[0].loadFactor);
    expect(JSON.stringify(a)).to.not.match(/NaN|Infinity/);
  });
});
