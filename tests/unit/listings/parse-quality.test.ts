import { describe, expect, it } from "vitest";
import { parseQuality } from "@/lib/listings/quality";

describe("reading a listing's stored quality declaration", () => {
  it("returns the stored object", () => {
    expect(parseQuality('{"herbicide":"none","species":"Eisenia fetida","pickup":false}')).toEqual({ herbicide: "none", species: "Eisenia fetida", pickup: false });
  });
  it("reads nothing, damage or a non-object as no declaration", () => {
    for (const text of [null, undefined, "", "{not json", "null", "42", '"text"', "[1,2]"]) expect(parseQuality(text)).toEqual({});
  });
});
