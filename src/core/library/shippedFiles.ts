/**
 * Every file in rulesets/, imported as data (`with { type: "json" }`) so that the
 * add-in bundle, the command line and the tests all carry the same rulesets.
 * Add a new file here when you add it to rulesets/; the list order is the order
 * in which pickers and listings show them.
 */
import asce710Strength from "../../../rulesets/asce7-10-strength.json" with { type: "json" };
import asce710Asd from "../../../rulesets/asce7-10-asd.json" with { type: "json" };
import asce716Strength from "../../../rulesets/asce7-16-strength.json" with { type: "json" };
import asce716StrengthOverstrength from "../../../rulesets/asce7-16-strength-overstrength.json" with { type: "json" };
import asce716Asd from "../../../rulesets/asce7-16-asd.json" with { type: "json" };
import asce716AsdOverstrength from "../../../rulesets/asce7-16-asd-overstrength.json" with { type: "json" };
import asce722Strength from "../../../rulesets/asce7-22-strength.json" with { type: "json" };
import asce722Asd from "../../../rulesets/asce7-22-asd.json" with { type: "json" };
import ibc2018Strength from "../../../rulesets/ibc2018-strength.json" with { type: "json" };
import ibc2018Asd from "../../../rulesets/ibc2018-asd.json" with { type: "json" };
import nycbc2022Strength from "../../../rulesets/nycbc2022-strength.json" with { type: "json" };
import en1990Str610 from "../../../rulesets/en1990-str-6.10.json" with { type: "json" };
import en1990Str610ab from "../../../rulesets/en1990-str-6.10ab.json" with { type: "json" };
import en1990Equ from "../../../rulesets/en1990-equ.json" with { type: "json" };
import en1990GeoSetC from "../../../rulesets/en1990-geo-set-c.json" with { type: "json" };
import en1990SlsCharacteristic from "../../../rulesets/en1990-sls-characteristic.json" with { type: "json" };
import en1990SlsFrequent from "../../../rulesets/en1990-sls-frequent.json" with { type: "json" };
import en1990SlsQuasiPermanent from "../../../rulesets/en1990-sls-quasi-permanent.json" with { type: "json" };
import en1990Accidental from "../../../rulesets/en1990-accidental.json" with { type: "json" };
import en1990Seismic from "../../../rulesets/en1990-seismic.json" with { type: "json" };
import nbcc2020Uls from "../../../rulesets/nbcc2020-uls.json" with { type: "json" };
import asnzs1170Strength from "../../../rulesets/asnzs1170-strength.json" with { type: "json" };

export const SHIPPED_RULESET_FILES: readonly unknown[] = [
  asce716Strength,
  asce716StrengthOverstrength,
  asce716Asd,
  asce716AsdOverstrength,
  asce722Strength,
  asce722Asd,
  asce710Strength,
  asce710Asd,
  ibc2018Strength,
  ibc2018Asd,
  nycbc2022Strength,
  en1990Str610,
  en1990Str610ab,
  en1990Equ,
  en1990GeoSetC,
  en1990SlsCharacteristic,
  en1990SlsFrequent,
  en1990SlsQuasiPermanent,
  en1990Accidental,
  en1990Seismic,
  nbcc2020Uls,
  asnzs1170Strength,
];
