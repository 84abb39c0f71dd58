// The efficiency panel's numbers as fmtPct writes them: a negative with the true minus "−" (U+2212), a rounded zero unsigned.
import { expect, test } from "vitest";
import { formatKindValue } from "./format";

test("an efficiency below zero reads with the true minus, one decimal, as fmtPct", () => {
  expect(formatKindValue("efficiency", -5)).toBe("−5.0"); // −5 % to one decimal (from memory)
  expect(formatKindValue("efficiency", -0.04)).toBe("0.0"); // −0.04 % to one decimal is zero (from memory)
  expect(formatKindValue("efficiency", 75)).toBe("75.0"); // 75 % (from memory)
});
