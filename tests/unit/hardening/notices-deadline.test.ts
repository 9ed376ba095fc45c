// The LISTEN connection never leaves a request waiting on a lost answer (src/lib/server/notices.ts).
// postgres.js can leave a statement unanswered for good when PostgreSQL restarts under it; the fault
// test (tests/faults) saw pg_notify hang that way and with it every request waiting on `caughtUp`.
// Here a stand-in server speaks just enough of the PostgreSQL frontend/backend protocol (PostgreSQL
// documentation, chapter "Frontend/Backend Protocol", message formats) to accept a connection and
// answer LISTEN, then stops answering: `caughtUp` must still resolve (false) within the statement
// deadline, and once the server answers again the bus listens again on a new connection.
// Common practice (bounded waits), no source.
import { createServer, type Socket } from "node:net";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

let answering = true;
const sockets: Socket[] = [];
const server = createServer((socket) => {
  sockets.push(socket);
  let buffer = Buffer.alloc(0);
  let started = false;
  const send = (type: string, body: Buffer = Buffer.alloc(0)) => {
    const head = Buffer.alloc(5);
    head.write(type, 0, "latin1");
    head.writeInt32BE(body.length + 4, 1);
    socket.write(Buffer.concat([head, body]));
  };
  const int32 = (n: number) => {
    const b = Buffer.alloc(4);
    b.writeInt32BE(n);
    return b;
  };
  socket.on("data", (chunk) => {
    buffer = Buffer.concat([buffer, chunk]);
    for (;;) {
      if (!started) {
        if (buffer.length < 4 || buffer.length < buffer.readInt32BE(0)) return;
        buffer = buffer.subarray(buffer.readInt32BE(0));
        started = true;
        send("R", int32(0)); // AuthenticationOk
        send("Z", Buffer.from("I")); // ReadyForQuery, idle
        continue;
      }
      if (buffer.length < 5 || buffer.length < 1 + buffer.readInt32BE(1)) return;
      const type = String.fromCharCode(buffer[0]);
      buffer = buffer.subarray(1 + buffer.readInt32BE(1));
      if (!answering) continue;
      if (type === "Q") {
        send("C", Buffer.from("LISTEN\0")); // a simple query: CommandComplete, then ReadyForQuery
        send("Z", Buffer.from("I"));
      } else if (type === "P") send("1"); // ParseComplete
      else if (type === "B") send("2"); // BindComplete
      else if (type === "D") send("n"); // NoData (LISTEN returns no rows)
      else if (type === "E") send("C", Buffer.from("LISTEN\0")); // CommandComplete
      else if (type === "S") send("Z", Buffer.from("I")); // ReadyForQuery
    }
  });
  socket.on("error", () => {});
});

let notices: typeof import("../../../src/lib/server/notices.ts");

beforeAll(async () => {
  await new Promise<void>((res) => server.listen(0, "127.0.0.1", res));
  const { port } = server.address() as { port: number };
  process.env.DATABASE_URL = `postgres://gavelwright@127.0.0.1:${port}/gavelwright`;
  process.env.DATABASE_CONNECT_TIMEOUT = "1";
  notices = await import("../../../src/lib/server/notices.ts");
});

afterAll(async () => {
  await notices?.endNotices();
  for (const s of sockets) s.destroy();
  await new Promise((res) => server.close(res));
});

describe("the LISTEN connection under a server that stops answering", () => {
  it("caughtUp answers false within the deadline, and the bus listens again on a new connection", async () => {
    await notices.onNotice("gw_test", () => {});
    expect(notices.isListening()).toBe(true);
    expect(sockets).toHaveLength(1);

    // The server keeps the connection open but answers nothing more (the fence's LISTEN and pg_notify).
    answering = false;
    // It answers once the statement deadline has passed (the connect timeout, 1 s here, plus 1 s; at
    // least 3 s); without the deadline it never answers and this test runs out of time.
    await expect(notices.caughtUp()).resolves.toBe(false);
    expect(notices.isListening()).toBe(false);

    // The server answers again: the retry opens a new connection and LISTEN is back in place.
    answering = true;
    await vi.waitFor(() => expect(notices.isListening()).toBe(true), { timeout: 15_000, interval: 100 });
    expect(sockets.length).toBeGreaterThanOrEqual(2);
  }, 30_000);
});
