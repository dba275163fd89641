import { describe, expect, it } from "vitest";
import { buildCsv, csvCell, csvComment } from "@/lib/csv/write";

describe("csvCell (RFC 4180 quoting, formula defusing)", () => {
  it("quotes a field with a comma, quote, CR or LF and doubles inner quotes (RFC 4180 §2.6, §2.7)", () => {
    expect(csvCell("a,b")).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell("line\r\nnext")).toBe('"line\r\nnext"');
    expect(csvCell("carriage\rreturn")).toBe('"carriage\rreturn"');
    expect(csvCell("plain")).toBe("plain");
  });

  it("defuses cells a spreadsheet would run as formulas (OWASP CSV injection)", () => {
    expect(csvCell('=HYPERLINK("http://x")')).toBe('"\'=HYPERLINK(""http://x"")"');
    expect(csvCell("+1+1")).toBe("'+1+1");
    expect(csvCell("-2+3")).toBe("'-2+3");
    expect(csvCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(csvCell("\tlead")).toBe("'\tlead");
  });

  it("leaves numbers as numbers, negative ones too", () => {
    expect(csvCell(-1.5)).toBe("-1.5");
    expect(csvCell("-1.5e-3")).toBe("-1.5e-3");
    expect(csvCell(632.8)).toBe("632.8");
    expect(csvCell(Number.NaN)).toBe("");
    expect(csvCell(null)).toBe("");
  });
});

describe("buildCsv", () => {
  it("ends every record with CRLF and keeps comments on one line", () => {
    const text = buildCsv({ comments: ["set: A\nB"], header: ["name", "x"], rows: [["a\rb", 1]] });
    expect(text).toBe('# set: A B\r\nname,x\r\n"a\rb",1\r\n');
    expect(csvComment("x\r\ny")).toBe("# x y");
  });
});
