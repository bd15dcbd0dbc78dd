import { describe, expect, it } from "vitest";
import { classifyTrailer, findImageEnd, sniffImage } from "@/lib/media/image-sniff";
import { HTML_PAYLOAD, noisy, solid, withJpegComment } from "./image-fixtures";

describe("sniffImage", () => {
  it("identifies the accepted formats from their bytes", async () => {
    expect(sniffImage(await solid(4, 4).jpeg().toBuffer())).toEqual({ kind: "image", format: "jpg" });
    expect(sniffImage(await solid(4, 4).png().toBuffer())).toEqual({ kind: "image", format: "png" });
    expect(sniffImage(await solid(4, 4).webp().toBuffer())).toEqual({ kind: "image", format: "webp" });
  });

  it("does not mistake a RIFF file that is not WebP (e.g. WAV) for WebP", () => {
    const wav = Buffer.concat([Buffer.from("RIFF"), Buffer.alloc(4), Buffer.from("WAVEfmt ")]);
    expect(sniffImage(wav).kind).toBe("unknown");
  });

  it("calls markup markup", () => {
    expect(sniffImage(Buffer.from("  <svg></svg>")).kind).toBe("markup");
    expect(sniffImage(Buffer.from("<!doctype html>")).kind).toBe("markup");
  });
});

describe("findImageEnd", () => {
  it.each([
    ["jpg", () => noisy(96, 64).jpeg().toBuffer()],
    ["jpg", () => noisy(96, 64).jpeg({ progressive: true }).toBuffer()],
    ["png", () => noisy(96, 64).png().toBuffer()],
    ["webp", () => noisy(96, 64).webp().toBuffer()],
  ] as const)("finds the end of a %s exactly", async (format, make) => {
    const img = await make();
    expect(findImageEnd(img, format)).toBe(img.length);
    expect(findImageEnd(Buffer.concat([img, HTML_PAYLOAD]), format)).toBe(img.length);
  });

  it("skips a comment segment that itself contains an end-of-image marker", async () => {
    const jpeg = await solid(16, 16).jpeg().toBuffer();
    const tricky = withJpegComment(jpeg, "fake end \xff\xd9 here");
    expect(findImageEnd(tricky, "jpg")).toBe(tricky.length);
  });

  it("returns null for a truncated file", async () => {
    const jpeg = await noisy(64, 64).jpeg().toBuffer();
    expect(findImageEnd(jpeg.subarray(0, 200), "jpg")).toBeNull();
  });
});

describe("classifyTrailer", () => {
  it.each([
    ["", "none"],
    ["\0\0\0\0", "padding"],
    ["<script>x()</script>", "markup"],
    ["junk\x00\x01<HTML>", "markup"],
    ["<a href=x>hi</a>", "markup"],
  ])("classifies %j as %s", (text, kind) => {
    expect(classifyTrailer(Buffer.from(text, "latin1"))).toBe(kind);
  });

  it("lets a binary trailer with a stray '<a' through as binary", () => {
    const bin = Buffer.from(Array.from({ length: 2048 }, (_, i) => (i * 97 + 3) % 256));
    bin.write("<a", 100, "latin1");
    expect(classifyTrailer(bin)).toBe("binary");
  });
});
