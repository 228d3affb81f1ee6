import { sql } from "drizzle-orm";
import { check, doublePrecision, index, integer, jsonb, pgEnum, pgTable, serial, text, timestamp } from "drizzle-orm/pg-core";
import { DATASET_KINDS, type DerivativeConventionInput, type Provenance } from "../../../shared/schemas/datasets.js";
import { alternatives } from "./alternatives.js";
import { bytea } from "./bytea.js";
import { users } from "./users.js";

export const aeroDatasetKind = pgEnum("aero_dataset_kind", DATASET_KINDS);

/**
 * Aerodynamic data of a deck alternative from section-model tests: flutter derivatives or static coefficients.
 * The uploaded file is kept byte for byte with its SHA-256; `delivered` holds its numbers as read, `converted`
 * the same data in the study convention (docs/conventions.md §Self-excited forces), so both can be shown and the conversion checked.
 */
export const aeroDatasets = pgTable(
  "aero_datasets",
  {
    id: serial("id").primaryKey(),
    alternativeId: integer("alternative_id")
      .notNull()
      .references(() => alternatives.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    kind: aeroDatasetKind("kind").notNull(),
    meanAngleDeg: doublePrecision("mean_angle_deg").notNull().default(0),
    provenance: jsonb("provenance").$type<Provenance>().notNull(),
    /** Flutter derivatives: abscissa, normalisation and sign convention as delivered. */
    convention: jsonb("convention").$type<DerivativeConventionInput>(),
    /** Static coefficients: "B" or "D", what C_D was normalised on. */
    dragReference: text("drag_reference"),
    deckWidthM: doublePrecision("deck_width_m").notNull(),
    deckDepthM: doublePrecision("deck_depth_m").notNull(),
    delivered: jsonb("delivered").$type<Record<string, unknown>>().notNull(),
    converted: jsonb("converted").$type<Record<string, unknown>>().notNull(),
    slopes: jsonb("slopes").$type<Record<string, unknown>>(),
    testedMin: doublePrecision("tested_min").notNull(),
    testedMax: doublePrecision("tested_max").notNull(),
    warnings: jsonb("warnings").$type<{ message: string; column?: string }[]>().notNull().default([]),
    fileName: text("file_name").notNull(),
    fileBytes: bytea("file_bytes").notNull(),
    fileSha256: text("file_sha256").notNull(),
    fileSizeBytes: integer("file_size_bytes").notNull(),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("aero_datasets_alternative_idx").on(t.alternativeId),
    check(
      "aero_datasets_kind_fields",
      sql`(${t.kind} = 'flutter-derivatives' and ${t.convention} is not null and ${t.dragReference} is null)
        or (${t.kind} = 'static-coefficients' and ${t.convention} is null and ${t.dragReference} in ('B', 'D'))`,
    ),
  ],
);

export type AeroDataset = typeof aeroDatasets.$inferSelect;
export type NewAeroDataset = typeof aeroDatasets.$inferInsert;
