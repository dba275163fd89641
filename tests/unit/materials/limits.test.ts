import { describe, expect, it } from "vitest";
import { materialById } from "@/lib/materials/library";
import { TERBIUM_GARNET_ENHANCEMENTS, materialOfParams, modelEnhancement, modelLimitWarnings } from "@/lib/materials/limits";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

const tgg = materialById("tgg")!;
const at = (over: { temperaturesK?: number[]; fieldsT?: number[]; wavelengthsNm?: number[] }) =>
  modelLimitWarnings({ params: tgg.params, temperaturesK: [293.15], fieldsT: [1], wavelengthsNm: [632.8, 1064], ...over });

describe("the model's limits where they bite", () => {
  it("inside every range of the library garnet: nothing to say", () => {
    expect(at({})).toEqual([]);
  });

  it("below 30 K: names the crystal-field structure and sets the published enhancements beside this model's", () => {
    const [line, ...rest] = at({ temperaturesK: [4.2, 300] });
    expect(rest).toEqual([]);
    // Yasuhara et al., Opt. Express 15, 11255 (2007): 87× at liquid-helium temperature; Majeed et al. (2013): 28× at 6.3 K.
    expect(line).toMatch(/^temperature: below ~30 K the free-ion model misses the terbium ground state's crystal-field structure/);
    expect(line).toContain("87× at 4.2 K (R. Yasuhara et al., Opt. Express 15, 11255 (2007))");
    expect(line).toContain("28× at 6.3 K");
    const model = TERBIUM_GARNET_ENHANCEMENTS.map((e) => modelEnhancement(tgg, e.temperatureK, e.wavelengthNm));
    expect(line).toContain(`this model gives ${Number(model[0]!.toPrecision(3))}× and ${Number(model[1]!.toPrecision(3))}×`);
  });

  it("any set with free-ion Tb³⁺ spins (g = 3/2, J = 6) gets the low-temperature line, library or not", () => {
    const w = modelLimitWarnings({ params: TERBIUM_GARNET_DEFAULTS, temperaturesK: [10], fieldsT: [1], wavelengthsNm: [632.8] });
    expect(w).toHaveLength(1);
    expect(modelLimitWarnings({ params: TERBIUM_GARNET_DEFAULTS, temperaturesK: [10], fieldsT: [1], wavelengthsNm: [200] })).toHaveLength(
      1,
    );
  });

  it("wavelengths outside the material's range and inside its Tb³⁺ band are named", () => {
    const w = at({ wavelengthsNm: [300, 485, 632.8, 2000] });
    expect(w[0]).toMatch(/^wavelength: Terbium gallium garnet is meant for 461\.6–1620 nm \(2 of 4 wavelengths outside\)/);
    expect(w[1]).toMatch(/^wavelength: 470–500 nm is the Tb³⁺ absorption band/);
  });

  it("a field beyond the stated range is named", () => {
    expect(at({ fieldsT: [-20] })[0]).toMatch(/^field: Terbium gallium garnet is meant for \|B0\| ≤ 10 T/);
  });

  it("a set keeps its material through a fit of κE and λE (same index background), not once the background changes", () => {
    const fitted = { ...tgg.params, gyrationPerT: 7e-3, oscillatorWavelengthNm: 250 };
    expect(materialOfParams(fitted)?.id).toBe("tgg");
    expect(materialOfParams(TERBIUM_GARNET_DEFAULTS)).toBeUndefined();
  });

  it("the model's enhancement at 4.2 K stays below the published 87× and at 6.3 K above the published 28× (reported, not hidden)", () => {
    // The free-ion Brillouin magnetization with θCW = 0 at 1 T; the published figures are above.
    expect(modelEnhancement(tgg, 4.2, 1053)).toBeLessThan(87);
    expect(modelEnhancement(tgg, 6.3, 632.8)).toBeGreaterThan(28);
  });
});
