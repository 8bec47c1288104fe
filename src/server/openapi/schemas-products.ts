import "server-only";
import { createProductSchema, deviceModelSchema, patchProductSchema, type Product } from "@/lib/schemas/products";
import { isoDateTime } from "./components";
import { describeFields, mirrors, named, z } from "./zod-openapi";

// The §9 product fields with their units and §5/§6 defaults, shared by the request and response schemas.
const FIELD_TEXT = {
  name: "Display name",
  customerId: "Customer account that owns the design; null for the fab's own",
  dieWidthMm: "Die width, in mm",
  dieHeightMm: "Die height, in mm",
  waferDiameterMm: "Wafer diameter, in mm",
  edgeExclusionMm: "Edge exclusion, in mm (default 0)",
  specLowS: "Lower spec limit LSL on G, in S; below it a die bins LOW",
  specHighS: "Upper spec limit USL on G, in S; above it a die bins HIGH",
  windowFactor: "Thermal window factor w: V_w = w·kT/q (default 0.5)",
  nonlinearityMax: "η_max: a nonlinearity index above it bins NONLINEAR (default 0.02)",
  openBelowS: "G_open, in S: a die below it bins OPEN",
  shortAboveS: "G_short, in S: a die above it bins SHORT",
  yieldFloor: "Lot yield floor, a fraction 0–1; a lot under it opens an excursion",
  rules: "Run rules on the control charts: Western Electric 1–4 (default) or Nelson 1–8",
  dieWindow: "Die window kind: static baseline median ± k·σ̂ (default) or per-wafer Part Average Testing",
  dieWindowK: "k of the die window (default 3 for static, 6 for pat)",
  displayUnit: "How the app shows G: S, µS or multiples of G₀ = 2q²/h",
  deviceModel: "Conductance-function model G(E) (§8), or null",
} as const;

const [stepModel, tableModel] = deviceModelSchema.options;

export const deviceModelBody = z
  .discriminatedUnion("kind", [
    describeFields(stepModel, {
      modes: "Number of modes M (whole channels)",
      transmission: "Transmission 𝒯 of each mode, 0–1",
      edgeEv: "Band edge E_c, in eV, on the axis of the Fermi level",
    }),
    describeFields(tableModel, { points: "Samples [E in eV, G in S] of the conductance function G(E)" }),
  ])
  .openapi("DeviceModel", {
    description: "step: M modes of transmission 𝒯 above a band edge, G(E) = M·𝒯·G₀ for E > E_c. table: G(E) sampled at the given energies.",
  });

// The shared field, pointed at the described DeviceModel component instead of an inline copy.
const modelField = deviceModelBody.nullable().optional().describe(FIELD_TEXT.deviceModel);

export const createProductBody = named(
  "CreateProduct",
  describeFields(createProductSchema, { code: "Product code, unique in the tenant: letters, digits, dot, dash, underscore", ...FIELD_TEXT }).safeExtend({ deviceModel: modelField }),
  "A new product. Omitted settings take the §5 and §6 defaults.",
);
export const patchProductBody = named("PatchProduct", describeFields(patchProductSchema, FIELD_TEXT).safeExtend({ deviceModel: modelField }), "The fields to change; the others keep their values.");

export const productSchema = mirrors<Product>()(
  z
    .object({
      code: z.string().describe("Product code"),
      name: z.string().describe(FIELD_TEXT.name),
      customerId: z.string().uuid().nullable().describe(FIELD_TEXT.customerId),
      customerName: z.string().nullable().describe("The owning customer's name"),
      dieWidthMm: z.number().describe(FIELD_TEXT.dieWidthMm),
      dieHeightMm: z.number().describe(FIELD_TEXT.dieHeightMm),
      waferDiameterMm: z.number().describe(FIELD_TEXT.waferDiameterMm),
      edgeExclusionMm: z.number().describe(FIELD_TEXT.edgeExclusionMm),
      specLowS: z.number().nullable().describe(FIELD_TEXT.specLowS),
      specHighS: z.number().nullable().describe(FIELD_TEXT.specHighS),
      windowFactor: z.number().describe(FIELD_TEXT.windowFactor),
      nonlinearityMax: z.number().describe(FIELD_TEXT.nonlinearityMax),
      openBelowS: z.number().nullable().describe(FIELD_TEXT.openBelowS),
      shortAboveS: z.number().nullable().describe(FIELD_TEXT.shortAboveS),
      yieldFloor: z.number().nullable().describe(FIELD_TEXT.yieldFloor),
      rules: z.enum(["western-electric", "nelson"]).describe(FIELD_TEXT.rules),
      dieWindow: z.enum(["static", "pat"]).describe(FIELD_TEXT.dieWindow),
      dieWindowK: z.number().describe(FIELD_TEXT.dieWindowK),
      displayUnit: z.enum(["S", "uS", "G0"]).describe(FIELD_TEXT.displayUnit),
      deviceModel: deviceModelBody.nullable(),
      updatedAt: isoDateTime,
    })
    .openapi("Product"),
);

export const productListSchema = z.object({ products: z.array(productSchema) }).openapi("ProductList");

// Control-limit versions (§6). The handler is being added alongside this document; the frozen values follow
// limitSetFromBaseline in src/domain/spc/limit-set.ts.
export const limitBaselineBody = z
  .union([
    z.object({ lots: z.array(z.string()).min(1).describe("Baseline lot numbers") }),
    z.object({ from: isoDateTime.describe("Baseline: lots probed at or after"), to: isoDateTime.describe("Baseline: lots probed at or before") }),
  ])
  .openapi("LimitBaseline", { description: "The baseline to compute limits from: a list of lots, or a date range." });

const individualsLimits = z.object({
  center: z.number(),
  sigma: z.number().describe("σ̂ = MR̄/d₂, d₂ = 1.128"),
  ucl: z.number(),
  lcl: z.number(),
  mrBar: z.number().describe("Mean moving range MR̄"),
  mrUcl: z.number(),
  mrLcl: z.number(),
  count: z.number().int().describe("Wafers in the chart"),
});

const xbarSLimits = z.object({
  center: z.number().describe("Grand mean x̿"),
  sBar: z.number().describe("Mean subgroup standard deviation s̄"),
  withinSigma: z.number().describe("s̄/c₄"),
  subgroupCount: z.number().int().describe("Baseline lots with 2 or more wafers"),
  nominalSize: z.number().int().describe("Most frequent wafers per lot; the limits are for this subgroup size"),
  sigma: z.number(),
  ucl: z.number().describe("x̿ + A₃·s̄"),
  lcl: z.number().describe("x̿ − A₃·s̄"),
  sUcl: z.number().describe("B₄·s̄"),
  sLcl: z.number().describe("B₃·s̄"),
});

const metricLimits = (unit: string) =>
  z
    .object({ individuals: individualsLimits, lotXbarS: xbarSLimits.nullable().describe("Lot-level X̄–S chart with wafers as the subgroup; null without a lot of 2+ wafers") })
    .describe(`Values in ${unit}`);

export const limitSetSchema = z
  .object({
    version: z.number().int().min(1).describe("Version number, counting up per product"),
    product: z.string().describe("Product code"),
    baseline: limitBaselineBody,
    lots: z.number().int().describe("Lots in the baseline"),
    wafers: z.number().int().describe("Wafers in the baseline"),
    waferMedianConductanceS: metricLimits("S: wafer median G"),
    waferYieldFraction: metricLimits("fractions 0–1: wafer yield"),
    frozenAt: isoDateTime,
    frozenBy: z.string().describe("Who froze it"),
  })
  .openapi("LimitSet", { description: "A frozen control-limit version. Lots are judged against the version in force when they were probed." });

export const limitSetListSchema = z.object({ versions: z.array(limitSetSchema).describe("Newest first") }).openapi("LimitSetList");
