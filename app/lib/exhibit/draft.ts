// The composer's unsaved settings: the form's text fields, and the spec the live preview computes
// from them (the saved spec with the typed span, medium and legibility laid over it).
import type { AgeUnit, LengthUnit } from "../units";
import type { MediumType } from "../scale/legibility";
import type { ExhibitSpec, UnitsPreference } from "./types";

export interface SettingsDraft {
  title: string;
  spanOlderValue: string;
  spanOlderUnit: AgeUnit;
  spanYoungerValue: string;
  spanYoungerUnit: AgeUnit;
  mediumType: MediumType;
  lengthValue: string;
  lengthUnit: LengthUnit;
  unitsPreference: UnitsPreference;
  minVisibleMm: string;
  minSpacingMm: string;
}

export function draftOf(title: string, s: ExhibitSpec): SettingsDraft {
  return {
    title,
    spanOlderValue: String(s.spanOlder.value),
    spanOlderUnit: s.spanOlder.unit,
    spanYoungerValue: String(s.spanYounger.value),
    spanYoungerUnit: s.spanYounger.unit,
    mediumType: s.medium.mediumType,
    lengthValue: s.medium.kind === "length" ? String(s.medium.length.value) : "",
    lengthUnit: s.medium.kind === "length" ? s.medium.length.unit : "m",
    unitsPreference: s.unitsPreference,
    minVisibleMm: s.legibility.minVisibleMetres ? String(s.legibility.minVisibleMetres * 1000) : "",
    minSpacingMm: s.legibility.minSpacingMetres ? String(s.legibility.minSpacingMetres * 1000) : "",
  };
}

export function specOfDraft(draft: SettingsDraft, saved: ExhibitSpec): ExhibitSpec {
  return {
    ...saved,
    spanOlder: { value: Number(draft.spanOlderValue), unit: draft.spanOlderUnit },
    spanYounger: { value: Number(draft.spanYoungerValue), unit: draft.spanYoungerUnit },
    medium: saved.medium.kind === "length" ? { ...saved.medium, mediumType: draft.mediumType, length: { value: Number(draft.lengthValue), unit: draft.lengthUnit } } : { ...saved.medium, mediumType: draft.mediumType },
    legibility: {
      ...(Number(draft.minVisibleMm) > 0 ? { minVisibleMetres: Number(draft.minVisibleMm) / 1000 } : {}),
      ...(Number(draft.minSpacingMm) > 0 ? { minSpacingMetres: Number(draft.minSpacingMm) / 1000 } : {}),
    },
    unitsPreference: draft.unitsPreference,
  };
}
