import request from "supertest";
import { agentFor, signUp, startTestApp, type TestApp } from "./harness";

/*
 * The API dispatches to the area routers by the first path segment. It must answer exactly as
 * Express's own in-order walk would: paths are case-insensitive, parameter routes still match,
 * an unknown segment gets the API's 404, and compute answers carry no ETag (nothing revalidates
 * them, so none is computed).
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const body = {
  organic: [{ solvent: "toluene", volumeMl: 30 }],
  aqueous: { solute: "water", volumeMl: 30 },
  temperatureC: 20,
};

describe("API dispatch by area", () => {
  it("matches paths case-insensitively, like Express", async () => {
    const lower = await request(t.app).post("/api/layers/predict").send(body);
    const upper = await request(t.app).post("/api/LAYERS/Predict").send(body);
    expect(lower.status).toBe(200);
    expect(upper.status).toBe(200);
    expect(upper.body.top).toEqual(lower.body.top);
  });

  it("answers an unknown area with the API's own 404 naming the route", async () => {
    const res = await request(t.app).get("/api/no-such-area/thing");
    expect(res.status).toBe(404);
    expect(res.body.error.message).toContain("/no-such-area/thing");
  });

  it("reaches routes with a parameter and group routes behind a session", async () => {
    const { agent } = await signUp(t.app, "dispatch");
    // A member without a group reaches the case route's own group check (403), not the API's 404.
    const res = await agent.get("/api/cases/00000000-0000-4000-8000-000000000000");
    expect(res.status).toBe(403);
    expect(res.body.error.code).not.toBe("not_found");
    expect((await agentFor(t.app).get("/api/cases")).status).toBe(401);
  });

  it("sends compute answers without an ETag", async () => {
    const res = await request(t.app).post("/api/layers/predict").send(body);
    expect(res.headers.etag).toBeUndefined();
  });
});
