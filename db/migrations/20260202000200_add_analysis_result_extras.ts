import type { Knex } from "knex";

/**
 * Display data of an analysis beyond the singular value spectra: the SSI-COV stabilisation
 * diagram (when SSI ran) and FRF magnitude/phase/coherence (when a force channel was
 * recorded), stored compactly as JSON; null when neither applies.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("analysis_results", (t) => {
    t.jsonb("extras").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("analysis_results", (t) => {
    t.dropColumn("extras");
  });
}
