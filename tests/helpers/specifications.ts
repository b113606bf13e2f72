/** Example test specifications shared by the quality tests (unit, integration and HTTP). */
import type { Specification } from "@/lib/quality/specification";

export const VISCOSITY_SPEC: Specification = {
  id: "5b3e0c1e-8c1a-4f7e-9d2b-3f6a1e2d4c01",
  property: "Viscosity",
  method: "Brookfield, spindle 1, 60 rpm, 25 °C",
  unit: "mPa·s",
  numeric: true,
  target: 5,
  lower: 4,
  upper: 6,
  requirement: null,
  origin: "entered",
};

export const APPEARANCE_SPEC: Specification = {
  id: "5b3e0c1e-8c1a-4f7e-9d2b-3f6a1e2d4c02",
  property: "Appearance",
  method: "Visual, 50 mL in a clear glass bottle",
  unit: "",
  numeric: false,
  target: null,
  lower: null,
  upper: null,
  requirement: "clear, no haze",
  origin: "entered",
};
