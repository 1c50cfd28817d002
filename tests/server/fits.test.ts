import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

// Puromycin, treated cells (Treloar 1974; Bates & Watts, Nonlinear Regression Analysis and Its Applications,
// 1988), as printed by R's nls: Vm = 212.6837431425 (SE 6.947), K = 0.06412128168 (SE 0.008281).
const puromycin = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1].map((s, index) => ({
  s,
  v: [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200][index],
}));

describe('POST /api/fits/*', () => {
  it('fits Michaelis–Menten and answers with the engine’s result', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    const { body } = await session.agent.post('/api/fits/michaelis-menten').set('X-CSRF-Token', session.csrfToken).send({ points: puromycin }).expect(200);
    expect(Math.abs(body.parameters.vmax.value / 212.6837431425 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(body.parameters.km.value / 0.06412128168 - 1)).toBeLessThan(1e-6);
    expect(body.parameters.vmax.se).toBeCloseTo(6.947, 3);
    expect(body).toMatchObject({ model: 'michaelis-menten', df: 10, n: 12, converged: true });
  });

  it('adds kcat with an enzyme concentration', async () => {
    const session = await signedIn(testApp.app, demoEmail('biologist'));
    const { body } = await session.agent
      .post('/api/fits/michaelis-menten')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ points: puromycin, enzymeConcentration: 0.5 })
      .expect(200);
    expect(Math.abs(body.parameters.kcat.value / (212.6837431425 / 0.5) - 1)).toBeLessThan(1e-6);
  });

  it('fits the other models', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    // Exact data from Vmax = 10, K½ = 2, n = 2 and from Vmax = 10, Km = 1, Ki = 8 (the model equations).
    const hill = [0.5, 1, 2, 4, 8, 16].map((s) => ({ s, v: (10 * s * s) / (4 + s * s) }));
    const hillFit = (await session.agent.post('/api/fits/hill').set('X-CSRF-Token', session.csrfToken).send({ points: hill }).expect(200)).body;
    expect(hillFit.parameters.hill.value).toBeCloseTo(2, 6);
    const inhibition = [0.25, 0.5, 1, 2, 4, 8, 16, 32].map((s) => ({ s, v: (10 * s) / (1 + s + (s * s) / 8) }));
    const inhibitionFit = (
      await session.agent.post('/api/fits/substrate-inhibition').set('X-CSRF-Token', session.csrfToken).send({ points: inhibition }).expect(200)
    ).body;
    expect(inhibitionFit.parameters.ki.value).toBeCloseTo(8, 5);
    const ph = Array.from({ length: 15 }, (_, index) => 3 + index / 2).map((x) => ({ ph: x, k: 1 / (1 + 10 ** (4.2 - x) + 10 ** (x - 8.4)) }));
    const bell = (await session.agent.post('/api/fits/ph-profile').set('X-CSRF-Token', session.csrfToken).send({ points: ph, model: 'bell' }).expect(200)).body;
    // k at the optimum = kmax/(1 + 2·10^(−(pKa2 − pKa1)/2)) = 0.984361871446 (the model's algebra).
    expect(bell.kAtOptimum.value).toBeCloseTo(0.984361871446, 8);
    expect(bell.phOptimum.value).toBeCloseTo(6.3, 8);
  });

  it('returns 400 with field messages for bad input', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    const tooFew = await session.agent
      .post('/api/fits/michaelis-menten')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ points: [{ s: 1, v: 1 }, { s: 1, v: 2 }] })
      .expect(400);
    expect(tooFew.body.error.fields).toEqual({ points: 'must contain at least three points with distinct substrate concentrations' });
    const negative = await session.agent
      .post('/api/fits/hill')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ points: [{ s: -1, v: 'fast' }] })
      .expect(400);
    expect(negative.body.error.fields).toMatchObject({ 'points.0.s': 'must be at least 0', 'points.0.v': 'must be a finite number' });
    const model = await session.agent.post('/api/fits/ph-profile').set('X-CSRF-Token', session.csrfToken).send({ points: [], model: 'tent' }).expect(400);
    expect(model.body.error.fields.model).toBe("must be 'bell', 'acid' or 'base'");
    await session.agent.post('/api/fits/hill').set('X-CSRF-Token', session.csrfToken).set('Content-Type', 'application/json').send('{"points": [').expect(400);
  });

  it('returns 401 when signed out and 403 without the CSRF token', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    await session.agent.post('/api/fits/michaelis-menten').send({ points: puromycin }).expect(403);
    await session.agent.post('/api/auth/sign-out').set('X-CSRF-Token', session.csrfToken).expect(204);
    const csrf = (await session.agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
    await session.agent.post('/api/fits/michaelis-menten').set('X-CSRF-Token', csrf).send({ points: puromycin }).expect(401);
  });
});
