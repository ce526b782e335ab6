import { describe, expect, test } from "vitest";
import { duplicateKeys, locatePath, rawIndexOfCharacter, syntaxErrorSpot } from "../../src/taskpane/jsonLocate.js";

describe("locatePath", () => {
  const text = ['{', '  "combinations": [', '    { "id": "1", "expression": "1.4D" },', '    { "id": "2", "expression": "1.2D + 1.6Lx" }', '  ]', '}'].join("\n");

  test("finds the character of an expression the problem names, by line and column", () => {
    // Hand count: line 4 is `    { "id": "2", "expression": "1.2D + 1.6Lx" }`; "Lx" is the 11th character of the expression.
    const spot = locatePath(text, ["combinations", 1, "expression"], 11);
    expect(spot).not.toBeNull();
    expect(spot?.line).toBe(4);
    expect(spot?.column).toBe('    { "id": "2", "expression": "1.2D + 1.6'.length + 1);
    expect(text.slice(spot?.offset, (spot?.offset ?? 0) + 2)).toBe("Lx");
  });

  test("counts an escaped character as one character of the expression", () => {
    // RFC 8259 §7: \u2212 is six characters of JSON text for one character (the minus sign "−") of the string.
    const escaped = '{"e": "1.2D \\u2212 1.0Wx"}';
    const spot = locatePath(escaped, ["e"], 11); // "1.2D − 1.0Wx": W is the 11th character (hand count)
    expect(escaped[spot?.offset ?? -1]).toBe("W");
    expect(rawIndexOfCharacter('"a\\nb"', 3)).toBe(4); // "a", newline, "b": b is raw index 4 after the quote and the two-character escape
  });

  test("gives the enclosing value for a field that is missing", () => {
    const spot = locatePath(text, ["combinations", 0, "clause"]);
    expect(spot?.line).toBe(3);
    expect(text.slice(spot?.offset, (spot?.offset ?? 0) + 1)).toBe("{");
  });
});

describe("duplicateKeys", () => {
  test("finds a field written twice, which JSON.parse would keep silently as the last one", () => {
    const text = '{\n  "symbols": {\n    "L": {"permanence": "transient"},\n    "L": {"permanence": "permanent"}\n  }\n}';
    // ECMA-262 JSON.parse: a later duplicate name overwrites the earlier one, with no error.
    expect((JSON.parse(text) as { symbols: { L: { permanence: string } } }).symbols.L.permanence).toBe("permanent");
    const found = duplicateKeys(text);
    expect(found.map((d) => ({ path: d.path, line: d.spot.line, column: d.spot.column }))).toEqual([{ path: ["symbols", "L"], line: 4, column: 5 }]);
  });

  test("finds none where every object's fields differ", () => {
    expect(duplicateKeys('{"a": {"x": 1}, "b": {"x": 2}, "c": [{"x": 1}, {"x": 2}]}')).toEqual([]);
  });
});

describe("syntaxErrorSpot", () => {
  test("places a missing comma at the line and column where the next field starts", () => {
    const spot = syntaxErrorSpot('{\n  "id": "a"\n  "title": "b"\n}');
    expect(spot).toMatchObject({ line: 3, column: 3 });
  });

  test("finds nothing in valid JSON", () => {
    expect(syntaxErrorSpot('{"a": [1, 2]}')).toBeNull();
  });
});
