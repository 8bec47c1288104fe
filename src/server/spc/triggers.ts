// Pure: which excursion triggers a lot judgement raises (§6) and what each one records.
import type { ExcursionFinding, ExcursionTrigger } from "@/lib/schemas/excursions";
import type { EdgeCheck } from "./edge-ring";

export interface RaisedTrigger {
  trigger: Exclude<ExcursionTrigger, "manual">;
  title: string;
  wafers: number[];
  findings: ExcursionFinding[];
}

interface JudgedLot {
  lot: string;
  product: string;
  hits: { chart: string; wafer: number | null; rule: string; description: string; value: number }[];
  yieldFloor: { floor: number | null; lotYield: number | null; broken: boolean };
  edge: EdgeCheck[];
}

const percent = (f: number) => `${(f * 100).toFixed(1)} %`;
const uniqueSorted = (values: (number | null)[]) => [...new Set(values.filter((v): v is number => v !== null))].sort((a, b) => a - b);

/** One trigger per kind that fired: rule hits on any chart, the yield floor broken, an edge ring on any wafer. */
export function lotTriggers(j: JudgedLot): RaisedTrigger[] {
  const raised: RaisedTrigger[] = [];
  if (j.hits.length > 0) {
    const rules = [...new Set(j.hits.map((h) => h.rule))].join(", ");
    raised.push({
      trigger: "rule",
      title: `${j.product}: control rule ${rules} broken at lot ${j.lot}`,
      wafers: uniqueSorted(j.hits.map((h) => h.wafer)),
      findings: j.hits.map((h) => ({ chart: h.chart, rule: h.rule, description: h.description, wafer: h.wafer, value: h.value })),
    });
  }
  const { floor, lotYield, broken } = j.yieldFloor;
  if (broken && floor !== null && lotYield !== null) {
    raised.push({
      trigger: "yield_floor",
      title: `${j.product}: lot ${j.lot} yield ${percent(lotYield)} under the floor of ${percent(floor)}`,
      wafers: [],
      findings: [{ chart: "Lot yield", rule: null, description: `Yield ${percent(lotYield)} is under the product's floor of ${percent(floor)}.`, wafer: null, value: lotYield }],
    });
  }
  const rings = j.edge.filter((e) => e.ring);
  if (rings.length > 0) {
    raised.push({
      trigger: "edge_ring",
      title: `${j.product}: edge ring on wafer ${rings.map((r) => r.wafer).join(", ")} of lot ${j.lot}`,
      wafers: rings.map((r) => r.wafer),
      findings: rings.map((r) => ({
        chart: "Edge vs centre yield",
        rule: null,
        description: `Edge zone ${percent(r.edgeYield ?? 0)} against centre ${percent(r.centreYield ?? 0)} over ${r.edgeTested} edge dies.`,
        wafer: r.wafer,
        value: r.gap,
      })),
    });
  }
  return raised;
}
