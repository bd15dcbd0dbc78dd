// safeCallbackPath (lib/auth/callback-url.ts): only same-site paths survive.
import { describe, expect, it } from "vitest";
import { safeCallbackPath } from "@/lib/auth/callback-url";

describe("callbackUrl", () => {
  const home: [string, unknown][] = [
    ["protocol-relative", "//evil.example/x"],
    ["slash-backslash", "/\\evil.example"],
    ["double backslash", "\\\\evil.example"],
    ["single backslash", "\\evil.example"],
    ["an absolute URL to another host", "https://evil.example/profile"],
    ["an absolute URL to this host's look-alike", "http://duffbank.test.evil.example/"],
    ["javascript:", "javascript:alert(1)"],
    ["data:", "data:text/html,hi"],
    ["encoded //", "%2F%2Fevil.example"],
    ["encoded /\\", "%2F%5Cevil.example"],
    ["half-encoded /%2F", "/%2Fevil.example"],
    ["half-encoded /%5C", "/%5Cevil.example"],
    ["double-encoded", "%252F%252Fevil.example"],
    ["triple-encoded", "%25252F%25252Fevil.example"],
    ["a tab between slashes", "/\t/evil.example"],
    ["a newline between slashes", "/\n/evil.example"],
    ["an encoded tab", "/%09/evil.example"],
    ["leading spaces before //", "  //evil.example"],
    ["a relative path", "profile"],
    ["an empty string", ""],
    ["broken encoding", "/%E0%A4%A"],
    ["not a string", 42],
    ["an array", ["/profile"]],
    ["undefined", undefined],
  ];
  it.each(home)("sends %s home", (_name, raw) => {
    expect(safeCallbackPath(raw)).toBe("/");
  });

  const kept: string[] = ["/", "/profile", "/beds?tab=open", "/listings/abc#photos", "/browse?q=leaf%20bags", "/sign-in/check-email"];
  it.each(kept)("keeps %s", (path) => {
    expect(safeCallbackPath(path)).toBe(path);
  });
});
