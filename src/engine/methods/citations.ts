/**
 * The sources the product cites, by stable key: each key is an anchor of the public methods page
 * (/methods#key), and every source string the API sends names its citations by these keys. Full
 * citations: author, title, edition, publisher and year where known, section or page; a standard's number
 * (clause where it was checked); "common practice" where there is no source. `status` says how the product
 * knows it (see provenance.ts); a figure recalled from a book says so on the page.
 */
import type { SourceStatus } from "../provenance";

export interface Citation {
  readonly key: string;
  /** A few words for a link: author or publisher and title. */
  readonly short: string;
  /** The full citation as one line of text. */
  readonly text: string;
  /** What the product takes from it. */
  readonly usedFor: string;
  readonly url?: string;
  readonly status: SourceStatus;
}

const SHORT_NAMES: Readonly<Record<string, string>> = {
  "iso-8855-2011": "ISO 8855:2011",
  "sae-j670-2008": "SAE J670 (JAN2008)",
  "barton-fieldhouse-2018": "Barton & Fieldhouse, Automotive Chassis Engineering",
  "super7thheaven-caster": "Super 7th Heaven glossary, caster angle",
  "norton-dom-5e": "Norton, Design of Machinery, 5th ed., ch. 4",
  "ghosal-2010": "Ghosal, The Freudenstein Equation (2010)",
  "suspensionsecrets-ic": "Suspension Secrets, instantaneous centre",
  "milliken-rcvd-1995": "Milliken & Milliken, Race Car Vehicle Dynamics",
  "jazar-vd-2e": "Jazar, Vehicle Dynamics, 2nd ed., ch. 7",
  "gillespie-fvd-1992": "Gillespie, Fundamentals of Vehicle Dynamics, ch. 6",
  "racecar-engineering-ackermann": "Racecar Engineering, Ackermann steering geometry",
  "shigley-mde-9e": "Shigley's Mechanical Engineering Design, 9th ed., §5-5",
  "shigley-mde-9e-torsion": "Shigley's Mechanical Engineering Design, 9th ed., ch. 3",
  "amesweb-torsion": "AmesWeb, torsional stress formula",
  "roark-7e": "Roark's Formulas for Stress and Strain, 7th ed.",
  "motor-constants": "Wikipedia, Motor constants",
  "simscape-universal-joint": "MathWorks Simscape Driveline, Universal Joint",
  "uicker-tmm": "Uicker, Pennock & Shigley, Theory of Machines and Mechanisms",
  "cv-joint-wikipedia": "Wikipedia, Constant-velocity joint",
  "sallei-universal-joint": "Sallei, The universal joint",
  "efunda-aisi-4140": "efunda, AISI 4140",
  "szfco-s45c": "Materials database extract, S45C / AISI 1045",
  "jis-g4051": "JIS G4051",
  "substech-7075": "SubsTech, 7075",
  "amesweb-7075": "AmesWeb, 7075 (MMPDS)",
  "additive-tools-pla": "additive.tools, PLA",
  "additive-tools-petg": "additive.tools, PETG",
  "additive-tools-pa12-cf": "additive.tools, PA12-CF",
  "babis-2025-pa12cf": "Babiș et al., Technologies 2025",
  "derived-here": "Derived for this product",
  "common-practice": "Common practice",
};

const c = (key: string, status: SourceStatus, text: string, usedFor: string, url?: string): Citation => ({ key, short: SHORT_NAMES[key] ?? key, status, text, usedFor, ...(url ? { url } : {}) });

export const CITATIONS: readonly Citation[] = [
  c("iso-8855-2011", "recalled", "ISO 8855:2011, Road vehicles — Vehicle dynamics and road-holding ability — Vocabulary. International Organization for Standardization, 2011. Clause numbers not checked; the wording on this page is ours.", "The vehicle axis system (x forward, y left, z up) and the names of the steering-axis figures."),
  c("sae-j670-2008", "recalled", "SAE J670, Vehicle Dynamics Terminology, revision JAN2008 (supersedes J670e, 1976). SAE International. Only the title and rationale page was seen; clause numbers not checked, definitions on this page in our words.", "Sign conventions of camber, kingpin inclination, caster, scrub radius and trail; spindle length and offset."),
  c("barton-fieldhouse-2018", "seen", "D. C. Barton and J. D. Fieldhouse, Automotive Chassis Engineering. Springer, 2018. §3.1.5.3 (kingpin offset at the ground, scrub radius) and §3.1.5.4 (kingpin offset at the hub).", "Scrub radius + when the steering axis meets the ground inboard of the contact centre; hub offset.", "https://fliphtml5.com/osspz/szqt/Automotive_Chassis_Engineering/128"),
  c("super7thheaven-caster", "seen", "Super 7th Heaven, glossary entry \"Caster angle\".", "Caster trail + when the steering axis meets the ground ahead of the contact centre.", "http://www.super7thheaven.co.uk/glossary/caster-angle/"),
  c("norton-dom-5e", "recalled", "R. L. Norton, Design of Machinery, 5th ed. McGraw-Hill, 2012. Ch. 4, \"Position analysis\": the algebraic (closed-form) solution of the fourbar linkage, its open and crossed branches and its toggle positions. Equation numbers not re-read.", "The front-view four-bar (arms and upright) and the steering four-bar (bellcrank, tie rod, steering arm)."),
  c("ghosal-2010", "seen", "A. Ghosal, \"The Freudenstein Equation: Design of Four-Link Mechanisms\", Resonance, August 2010, pp. 699–710 (introduction seen).", "Freudenstein's equation of the four-bar, the reference the bellcrank solution is checked against.", "https://www.scribd.com/doc/301947119/Freudenstein-equation"),
  c("suspensionsecrets-ic", "seen", "Suspension Secrets, \"Instantaneous centre\".", "The instant centre where the extended wishbone lines meet; the roll centre where the contact-patch–instant-centre line crosses the centreline.", "https://suspensionsecrets.co.uk/instantaneous-centre/"),
  c("milliken-rcvd-1995", "recalled", "W. F. Milliken and D. L. Milliken, Race Car Vehicle Dynamics. SAE International, 1995. Ch. 17 \"Suspension geometry\" (swing-arm length, camber in roll) and ch. 19 \"Steering systems\" (percent Ackermann, steer-induced camber). Not re-read.", "The roll-centre and camber-change pictures; the turn-centre picture of 100 %, 0 % and reverse Ackermann."),
  c("jazar-vd-2e", "recalled", "R. N. Jazar, Vehicle Dynamics: Theory and Application, 2nd ed. Springer, 2014. Ch. 7 \"Steering dynamics\": the kinematic steering condition cot δo − cot δi = w/l and the trapezoidal steering mechanism. Not re-read.", "The ideal (Ackermann) steering condition and the trapezoid the steering solver is checked against."),
  c("gillespie-fvd-1992", "recalled", "T. D. Gillespie, Fundamentals of Vehicle Dynamics. SAE, 1992. Ch. 6 \"Steady-state cornering\", low-speed turning. Not re-read.", "Low-speed (kinematic) turning: the wheel axes meet on the rear axle line."),
  c("racecar-engineering-ackermann", "seen", "Racecar Engineering, \"Tech Explained: Ackermann Steering Geometry\".", "Inner and outer wheel angles of the ideal turn from the turn radius, wheelbase and track.", "https://www.racecar-engineering.com/articles/tech-explained-ackermann-steering-geometry/"),
  c("shigley-mde-9e", "seen", "R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th ed. McGraw-Hill, 2011. §5-5 \"Distortion-energy theory for ductile materials\", eqs. (5-20) and (5-21): pure shear yields at S_sy = S_y/√3 ≈ 0.577 S_y, about 15 % above the maximum-shear-stress value 0.5 S_y.", "The allowable shear stress of a ductile shaft material."),
  c("shigley-mde-9e-torsion", "recalled", "R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th ed. McGraw-Hill, 2011. Ch. 3, torsion of round bars: τ = T r / J. Section number not re-read.", "Torsional shear stress at the neck surface."),
  c("amesweb-torsion", "seen", "AmesWeb, \"Torsional stress formula\" (solid and hollow round shafts, τ = T ρ / J, twist T L / (G J)).", "Torsional shear of a solid or hollow neck.", "https://amesweb.info/Torsion/torsional-stress-formula.aspx"),
  c("roark-7e", "recalled", "W. C. Young and R. G. Budynas, Roark's Formulas for Stress and Strain, 7th ed. Torsion chapter. Not re-read.", "Torsion of round sections (a second reference for the same formula)."),
  c("motor-constants", "seen", "Wikipedia, \"Motor constants\" (copy seen at tickerdossier.com): K_T = τ / I_a = 60 / (2π K_v(rpm)).", "The motor's torque from its speed constant Kv and current.", "https://tickerdossier.com/wiki/motor-constants"),
  c("simscape-universal-joint", "seen", "MathWorks, Simscape Driveline documentation, \"Universal Joint\" block: ω_F = cos A / (1 − sin²A cos²θ_B) · ω_B. Cited as the documentation of a general physical-modelling library.", "The speed ratio of a single cardan joint over a turn.", "https://mathworks.com/help/sdl/ref/universaljoint.html"),
  c("uicker-tmm", "recalled", "J. J. Uicker, G. R. Pennock and J. E. Shigley, Theory of Machines and Mechanisms. Hooke's joint, in the chapter on spatial mechanisms. Not re-read.", "The cardan joint's speed ratio (a second reference)."),
  c("cv-joint-wikipedia", "seen", "Wikipedia, \"Constant-velocity joint\", citing NTN Technical Review No. 75 (2007): fixed ball-type joints 45–48° typical, special designs 54°.", "The typical rated angle of a ball-type CV joint."),
  c("sallei-universal-joint", "seen", "Sallei, \"The universal joint\" (a maker's page): about 45° absolute maximum, about 15° best for wear.", "Guidance on cardan joint angles.", "http://sallei.com/en-the-universal-joint.html"),
  c("efunda-aisi-4140", "seen", "efunda, \"AISI 4140 alloy steel\" properties by heat treatment (annealed, normalised, oil-quenched and tempered at 205–650 °C).", "Yield and ultimate strength of AISI 4140 in each condition.", "https://www.efunda.com/materials/alloys/alloy_steels/show_alloy.cfm?ID=aisi_4140&show_prop=uts&Page_Title=Alloy%20Steel%20aisi%204140"),
  c("szfco-s45c", "seen", "A materials database extract listing JIS S45C as an equivalent of AISI 1045 (cold drawn and annealed round bar). A weak source: replace it with the bar's certificate.", "Yield and ultimate strength of AISI 1045 / S45C bar.", "https://szfco.com/thread-25568-1-351.html"),
  c("jis-g4051", "recalled", "JIS G4051, Carbon steels for machine structural use (S45C, normalised and quenched-and-tempered minimum strengths). Recalled, not checked against the standard's text: check it.", "Minimum yield and ultimate strength of S45C."),
  c("substech-7075", "seen", "SubsTech, \"Wrought aluminum-zinc-magnesium alloy 7075\" (7075-T6: yield 503 MPa, tensile 572 MPa).", "Yield strength of 7075-T6 / T651.", "http://ww.substech.com/dokuwiki/doku.php?do=export_xhtml&id=wrought_aluminum-zinc-magnesium_alloy_7075"),
  c("amesweb-7075", "seen", "AmesWeb, \"Aluminum 7075 rods, bars, shapes properties\" (design allowables by temper and thickness per MMPDS).", "7075 design allowables (a second reference).", "https://amesweb.info/Materials/Aluminum-7075-Rods-Bars-Shapes-Properties.aspx"),
  c("additive-tools-pla", "seen", "additive.tools, \"PLA\" material page: ranges aggregated across sources (tensile 50–65 MPa in-plane, 35–45 MPa across layers).", "Across-layer strength of printed PLA.", "https://additive.tools/materials/pla"),
  c("additive-tools-petg", "seen", "additive.tools, \"PETG\" material page: ranges aggregated across sources (tensile 44–56 MPa in-plane, 25–38 MPa across layers).", "Across-layer strength of printed PETG.", "https://additive.tools/materials/petg"),
  c("additive-tools-pa12-cf", "seen", "additive.tools, \"PA12-CF\" material page (SLS): yield 38–50 MPa across layers.", "Across-layer strength of SLS PA12 with carbon fibre.", "https://additive.tools/materials/pa12-cf"),
  c("babis-2025-pa12cf", "seen", "Babiș et al., Technologies 2025, 13(10), 456: FFF PA12 + carbon fibre annealed 80 °C for 5 h; 8.78 MPa printed vertically, about 0.32 × the strongest orientation.", "Across-layer strength of printed, annealed PA12-CF.", "https://www.mdpi.com/2227-7080/13/10/456"),
  c("derived-here", "derived", "Derived for this product from the geometry stated in the entry that cites it, and checked numerically by a second, independent method (a brute-force or closed-form check); no published source was found.", "Formulas with no published treatment: the neck-in-cup limit, the camber-gain lever, the ground offsets, the exact steer camber, the steering stop."),
  c("common-practice", "common-practice", "Common practice: a fact of the trade or plain geometry (Rodrigues' rotation, a rigid tyre's contact point) with no published source cited; values of our own say so where they are used.", "Conventions, rigid-body construction and settings chosen by the product."),
];

const BY_KEY = new Map(CITATIONS.map((x) => [x.key, x]));

/** The citation with this key; throws for an unknown key (a programming error, caught by the tests). */
export function citationByKey(key: string): Citation {
  const found = BY_KEY.get(key);
  if (!found) throw new Error(`unknown citation key "${key}"`);
  return found;
}

export function isCitationKey(key: string): boolean {
  return BY_KEY.has(key);
}
