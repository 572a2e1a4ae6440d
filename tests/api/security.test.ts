import request from "supertest";
import { count } from "drizzle-orm";
import { openDatabase, type DatabaseHandle } from "../../db/client";
import { organization } from "../../db/schema";
import { createApp } from "../../server/app";
import { createRecordingMailer } from "../../server/mail";
import { normaliseOrigin } from "../../server/middleware/origin";
import { ORIGIN, agentFor, signUp, startTestApp, uniqueEmail, type TestApp } from "./harness";

/*
 * Sign-in and browser-facing protections: the sign-in rate limit, session cookie attributes
 * (httpOnly, SameSite, Secure behind HTTPS), security headers, and refusal of cross-site writes.
 * Expected attributes follow the cookie rules of RFC 6265bis (the __Secure- prefix requires
 * Secure) and the OWASP Secure Headers recommendations.
 */

let t: TestApp;
let limited: TestApp;
beforeAll(async () => {
  [t, limited] = await Promise.all([startTestApp(), startTestApp({ rateLimit: true })]);
});
afterAll(async () => {
  await Promise.all([t.close(), limited.close()]);
});

async function groupCount(app: TestApp): Promise<number> {
  const rows = await app.db.select({ n: count() }).from(organization);
  return Number(rows[0]?.n ?? 0);
}

/** Each Set-Cookie line as { name, attrs } with lower-case attribute names. */
function cookiesOf(res: request.Response) {
  const raw = res.headers["set-cookie"] as unknown as string[] | undefined;
  return (raw ?? []).map((line) => {
    const [pair, ...rest] = line.split(";").map((s) => s.trim());
    const eq = pair!.indexOf("=");
    const attrs = new Map(rest.map((a) => [a.split("=")[0]!.toLowerCase(), a.split("=")[1] ?? ""]));
    return { name: pair!.slice(0, eq), value: pair!.slice(eq + 1), attrs };
  });
}

describe("sign-in rate limit", () => {
  it("refuses the 11th sign-in within a minute with 429, even with the right password", async () => {
    const { email, password } = await signUp(limited.app, "limited");
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const res = await agentFor(limited.app).post("/api/auth/sign-in/email").send({ email, password: `wrong-guess-${i}` });
      statuses.push(res.status);
    }
    // The rule in server/auth.ts: 10 sign-ins per 60 s per client address.
    expect(statuses).toEqual(Array(10).fill(401));
    const blocked = await agentFor(limited.app).post("/api/auth/sign-in/email").send({ email, password });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers["x-retry-after"])).toBeGreaterThan(0);
  });

  it("keys on the socket address, so a forged forwarding header does not reset the count", async () => {
    const { email } = await signUp(limited.app, "forger");
    const res = await agentFor(limited.app)
      .post("/api/auth/sign-in/email")
      .set("X-Forwarded-For", "203.0.113.77")
      .set("X-Phasewise-Client-Ip", "203.0.113.78")
      .send({ email, password: "another-wrong-guess" });
    // The previous test used up this address's allowance.
    expect(res.status).toBe(429);
  });

  it("is off in the default test harness, so other suites can sign in freely", async () => {
    const { email } = await signUp(t.app, "unlimited");
    for (let i = 0; i < 12; i++) {
      const res = await agentFor(t.app).post("/api/auth/sign-in/email").send({ email, password: `wrong-${i}` });
      expect(res.status).toBe(401);
    }
  });
});

describe("session cookies", () => {
  it("are httpOnly and SameSite=Lax over plain HTTP on localhost (not Secure, or the browser would drop them)", async () => {
    const res = await agentFor(t.app)
      .post("/api/auth/sign-up/email")
      .send({ name: "Cookie", email: uniqueEmail("cookie"), password: "cookie-password-1" });
    expect(res.status).toBe(200);
    const session = cookiesOf(res).find((c) => c.name === "better-auth.session_token");
    expect(session).toBeDefined();
    expect(session!.attrs.has("httponly")).toBe(true);
    expect(session!.attrs.get("samesite")?.toLowerCase()).toBe("lax");
    expect(session!.attrs.has("secure")).toBe(false);
    expect(session!.attrs.get("path")).toBe("/");
  });

  describe("served over HTTPS", () => {
    const httpsOrigin = "https://phasewise.lab.example";
    let handle: DatabaseHandle;
    let app: ReturnType<typeof createApp>["app"];
    beforeAll(async () => {
      handle = await openDatabase({ dataDir: "memory://" });
      ({ app } = createApp({
        db: handle.db,
        dbKind: handle.kind,
        mail: createRecordingMailer(),
        baseURL: httpsOrigin,
        rateLimit: { enabled: false },
        quiet: true,
        dataDir: `/tmp/phasewise-test-https-${process.pid}`,
      }));
    });
    afterAll(async () => {
      await handle.close();
    });

    it("are Secure, httpOnly and SameSite=Lax with the __Secure- prefix", async () => {
      const res = await request(app)
        .post("/api/auth/sign-up/email")
        .set("Origin", httpsOrigin)
        .send({ name: "Secure", email: uniqueEmail("secure"), password: "secure-password-1" });
      expect(res.status).toBe(200);
      const cookies = cookiesOf(res);
      expect(cookies.length).toBeGreaterThan(0);
      for (const c of cookies) {
        expect(c.name.startsWith("__Secure-")).toBe(true);
        expect(c.attrs.has("secure")).toBe(true);
        expect(c.attrs.has("httponly")).toBe(true);
        expect(c.attrs.get("samesite")?.toLowerCase()).toBe("lax");
      }
      expect(res.headers["strict-transport-security"]).toMatch(/max-age=\d+/);
    });
  });
});

describe("security headers", () => {
  it("sends helmet's headers and a same-origin content policy, and hides the framework", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.status).toBe(200);
    const h = res.headers;
    expect(h["x-content-type-options"]).toBe("nosniff");
    expect(h["x-frame-options"]).toBe("SAMEORIGIN");
    expect(h["referrer-policy"]).toBe("no-referrer");
    expect(h["cross-origin-opener-policy"]).toBe("same-origin");
    expect(h["strict-transport-security"]).toMatch(/max-age=\d+/);
    const csp = String(h["content-security-policy"]);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("frame-ancestors 'self'");
    expect(csp).toContain("object-src 'none'");
    expect(h["x-powered-by"]).toBeUndefined();
    // No CORS: another site's script cannot read our answers.
    const cross = await request(t.app).get("/api/health").set("Origin", "https://elsewhere.example");
    expect(cross.headers["access-control-allow-origin"]).toBeUndefined();
  });
});

describe("cross-origin writes", () => {
  it("refuses a signed-in POST from another site and changes nothing", async () => {
    const { agent } = await signUp(t.app, "victim");
    const before = await groupCount(t);
    const res = await agent.post("/api/groups").set("Origin", "https://elsewhere.example").send({ name: "Forged group" });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("cross_origin");
    expect(await groupCount(t)).toBe(before);
    // The same agent from our own page succeeds.
    const own = await agent.post("/api/groups").set("Origin", ORIGIN).send({ name: "Real group" });
    expect(own.status).toBe(201);
    expect(await groupCount(t)).toBe(before + 1);
  });

  it.each([
    ["an opaque origin", "null"],
    ["a look-alike host", "http://localhost:3000.elsewhere.example"],
    ["another port", "http://localhost:3001"],
    ["another scheme", "https://localhost:3000"],
  ])("refuses %s (%s)", async (_label, origin) => {
    const { agent } = await signUp(t.app, "variants");
    const res = await agent.post("/api/groups").set("Origin", origin).send({ name: "Forged group" });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("cross_origin");
  });

  it("refuses a cookie-carrying write without any Origin", async () => {
    const up = await request(t.app)
      .post("/api/auth/sign-up/email")
      .set("Origin", ORIGIN)
      .send({ name: "Originless", email: uniqueEmail("no-origin"), password: "no-origin-password-1" });
    expect(up.status).toBe(200);
    const cookie = cookiesOf(up).map((c) => `${c.name}=${c.value}`).join("; ");
    expect((await request(t.app).get("/api/me").set("Cookie", cookie)).status).toBe(200);
    const before = await groupCount(t);
    const res = await request(t.app).post("/api/groups").set("Cookie", cookie).send({ name: "Originless group" });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("cross_origin");
    expect(await groupCount(t)).toBe(before);
  });

  it("accepts a write without Origin or cookie (scripts, the public layer check)", async () => {
    const res = await request(t.app)
      .post("/api/layers/predict")
      .send({ organic: [{ solvent: "toluene", volumeMl: 50 }], aqueous: { solute: "water", volumeMl: 50 }, temperatureC: 20 });
    expect(res.status).toBe(200);
  });

  it("lets reads through from anywhere (they change nothing, and CORS keeps the answer private)", async () => {
    const { agent } = await signUp(t.app, "reader");
    const res = await agent.get("/api/me").set("Origin", "https://elsewhere.example");
    expect(res.status).toBe(200);
  });

  it("leaves better-auth's own routes to its origin check, which also refuses another site", async () => {
    const { agent } = await signUp(t.app, "signout");
    const res = await agent.post("/api/auth/sign-out").set("Origin", "https://elsewhere.example").send({});
    expect(res.status).toBe(403);
    expect((await agent.get("/api/me")).status).toBe(200);
  });
});

describe("normaliseOrigin", () => {
  it.each([
    ["http://LOCALHOST:3000", "http://localhost:3000"],
    ["https://lab.example:443", "https://lab.example"],
    ["http://localhost:3000/", "http://localhost:3000"],
    ["null", null],
    ["file:///etc/passwd", null],
    ["not a url", null],
  ])("%s → %s", (input, expected) => {
    expect(normaliseOrigin(input)).toBe(expected);
  });
});
