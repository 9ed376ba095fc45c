// Issue 17, item 1: the client address is the connection's peer unless that peer is a proxy the
// operator lists (TRUSTED_PROXIES); then the right-most X-Forwarded-For hop that is not a listed
// proxy. Hops to its left were written by the client. (MDN, "X-Forwarded-For", section "Selecting
// an IP address": the right-most untrusted address when trusted proxies are known, paraphrase.)
import { describe, expect, it } from "vitest";
import { lockSeconds } from "../../../src/lib/server/account-throttle.ts";
import { parseTrustedProxies, resolveClientAddress } from "../../../src/lib/server/client-address.ts";

const none = parseTrustedProxies(undefined);
const proxies = parseTrustedProxies("10.0.0.0/8, 192.0.2.7 fd00::/8");

describe("resolveClientAddress", () => {
  it("takes the peer and ignores X-Forwarded-For when no proxy is listed", () => {
    expect(resolveClientAddress("203.0.113.9", "1.2.3.4", none)).toBe("203.0.113.9");
    expect(resolveClientAddress("::ffff:203.0.113.9", null, none)).toBe("203.0.113.9");
  });

  it("ignores X-Forwarded-For from a peer that is not a listed proxy", () => {
    expect(resolveClientAddress("203.0.113.9", "10.0.0.1", proxies)).toBe("203.0.113.9");
  });

  it("behind a listed proxy, takes the right-most hop that is not a listed proxy", () => {
    expect(resolveClientAddress("10.1.2.3", "6.6.6.6, 198.51.100.4", proxies)).toBe("198.51.100.4");
    expect(resolveClientAddress("10.1.2.3", "6.6.6.6, 198.51.100.4, 192.0.2.7", proxies)).toBe("198.51.100.4");
    expect(resolveClientAddress("fd00::1", "2001:db8::5", proxies)).toBe("2001:db8::5");
  });

  it("when every hop is a listed proxy, the left-most; a malformed hop stops at the last good one", () => {
    expect(resolveClientAddress("10.1.2.3", "10.9.9.9, 192.0.2.7", proxies)).toBe("10.9.9.9");
    expect(resolveClientAddress("10.1.2.3", "not-an-address, 192.0.2.7", proxies)).toBe("192.0.2.7");
    expect(resolveClientAddress("10.1.2.3", null, proxies)).toBe("10.1.2.3");
  });

  it("has no address without a peer", () => {
    expect(resolveClientAddress(undefined, "1.2.3.4", proxies)).toBeNull();
  });

  it("refuses a malformed TRUSTED_PROXIES entry at start-up", () => {
    expect(() => parseTrustedProxies("10.0.0.0/33")).toThrow(/TRUSTED_PROXIES/);
    expect(() => parseTrustedProxies("proxy.example")).toThrow(/TRUSTED_PROXIES/);
  });
});

describe("per-account back-off (common practice, no source; the numbers are ours)", () => {
  it("is free for 5 failures, then 30 s doubling to at most 15 min", () => {
    expect([1, 2, 3, 4, 5].map(lockSeconds)).toEqual([0, 0, 0, 0, 0]);
    expect([6, 7, 8, 9, 10, 11, 50].map(lockSeconds)).toEqual([30, 60, 120, 240, 480, 900, 900]);
  });
});
