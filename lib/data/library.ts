import "server-only";
import { Op, QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { isUuid } from "@/lib/library/ids";
import type { LibraryEntry, LibraryQuery } from "@/lib/validations/library";
import { Trial } from "@/models";

/*
 * The public library: published trials only. Every read here filters on status = 'published'
 * itself, so an unpublished trial cannot appear, however it is asked for.
 */

interface Row {
  id: string;
  title: string;
  crop: string;
  season: string;
  siteName: string;
  region: string;
  publishedAt: Date | null;
  methods: Array<{ name: string; category: string }>;
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (match) => `\\${match}`);

export async function publishedTrials(query: Partial<LibraryQuery> = {}): Promise<LibraryEntry[]> {
  const conditions = ["t.status = 'published'"];
  const replacements: Record<string, string> = {};
  if (query.q) {
    conditions.push("(t.title ILIKE :q OR t.crop ILIKE :q OR s.name ILIKE :q OR s.region ILIKE :q OR t.objective ILIKE :q)");
    replacements.q = `%${escapeLike(query.q)}%`;
  }
  if (query.crop) {
    conditions.push("lower(t.crop) = lower(:crop)");
    replacements.crop = query.crop;
  }
  if (query.region) {
    conditions.push("lower(s.region) = lower(:region)");
    replacements.region = query.region;
  }
  if (query.season) {
    conditions.push("t.season = :season");
    replacements.season = query.season;
  }
  if (query.method) {
    conditions.push("EXISTS (SELECT 1 FROM treatments m WHERE m.trial_id = t.id AND m.category = :method)");
    replacements.method = query.method;
  }
  const rows = await db().query<Row>(
    `SELECT t.id, t.title, t.crop, t.season, s.name AS "siteName", s.region, ts.published_at AS "publishedAt",
            COALESCE((SELECT json_agg(json_build_object('name', m.name, 'category', m.category) ORDER BY m.position)
                        FROM treatments m WHERE m.trial_id = t.id AND m.check_type IS NULL), '[]') AS methods
       FROM trials t
       JOIN sites s ON s.id = t.site_id
       LEFT JOIN trial_summaries ts ON ts.trial_id = t.id
      WHERE ${conditions.join(" AND ")}
      ORDER BY t.season DESC, t.title ASC`,
    { replacements, type: QueryTypes.SELECT },
  );
  return rows.map((row) => ({ ...row, publishedAt: row.publishedAt ? new Date(row.publishedAt) : null }));
}

/** Crops, methods, regions and seasons among published trials, for the filter menus. */
export async function libraryChoices(): Promise<{ crops: string[]; methods: string[]; regions: string[]; seasons: string[] }> {
  const rows = await db().query<{ crop: string; region: string; season: string; categories: string[] }>(
    `SELECT t.crop, s.region, t.season,
            COALESCE((SELECT array_agg(DISTINCT m.category) FROM treatments m WHERE m.trial_id = t.id AND m.category <> 'check'), '{}') AS categories
       FROM trials t JOIN sites s ON s.id = t.site_id WHERE t.status = 'published'`,
    { type: QueryTypes.SELECT },
  );
  const sorted = (values: string[]) => [...new Set(values)].sort((a, b) => a.localeCompare(b));
  return {
    crops: sorted(rows.map((row) => row.crop)),
    methods: sorted(rows.flatMap((row) => row.categories)),
    regions: sorted(rows.map((row) => row.region)),
    seasons: sorted(rows.map((row) => row.season)).reverse(),
  };
}

/** A published trial by id, or null: unpublished and unknown trials look alike. */
export async function publishedTrial(trialId: string): Promise<Trial | null> {
  if (!isUuid(trialId)) return null;
  db();
  return Trial.findOne({ where: { id: trialId, status: { [Op.eq]: "published" } } });
}
