import { sql } from 'drizzle-orm'
import { check, integer, jsonb, pgTable, primaryKey, text, timestamp } from 'drizzle-orm/pg-core'
import { createInsertSchema } from 'drizzle-zod'
import { z } from 'zod'
import { users } from './users'

/** A heading's status in an AGS4 dictionary (DICT_STAT). */
export const agsStatuses = ['KEY', 'REQUIRED', 'KEY+REQUIRED', 'OTHER'] as const

/** One heading of a standard group as its edition's dictionary defines it. */
export interface AgsHeadingDefinition {
  name: string
  status: (typeof agsStatuses)[number]
  /** DICT_DTYP: 2DP, X, PA, DT… */
  type: string
  /** DICT_UNIT; empty for none. */
  unit: string
}

/** An AGS4 edition number as TRAN_AGS writes it: 4.0.4, 4.1, 4.1.1. */
export const AGS_EDITION_FORM = /^4\.\d{1,2}(\.\d{1,2})?$/

/**
 * A standard dictionary an administrator loaded, one per AGS4 edition: the file it came from and
 * what it holds. Files declaring this edition are checked against it.
 */
export const agsDictionaries = pgTable(
  'ags_dictionaries',
  {
    edition: text('edition').primaryKey(),
    fileName: text('file_name').notNull(),
    fileSize: integer('file_size').notNull(),
    /** SHA-256 (hex) of the uploaded bytes. */
    sha256: text('sha256').notNull(),
    groupCount: integer('group_count').notNull(),
    headingCount: integer('heading_count').notNull(),
    loadedBy: integer('loaded_by').references(() => users.id, { onDelete: 'set null' }),
    loadedAt: timestamp('loaded_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('ags_dictionaries_edition_form', sql`${t.edition} ~ '^4\\.[0-9]{1,2}(\\.[0-9]{1,2})?$'`),
  ],
)

/** One group of a loaded dictionary: its parent, title and headings in dictionary order. */
export const agsDictionaryGroups = pgTable(
  'ags_dictionary_groups',
  {
    edition: text('edition')
      .notNull()
      .references(() => agsDictionaries.edition, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** The group's place in the dictionary file, from 0. */
    position: integer('position').notNull(),
    parent: text('parent'),
    title: text('title').notNull(),
    headings: jsonb('headings').$type<AgsHeadingDefinition[]>().notNull(),
  },
  (t) => [primaryKey({ columns: [t.edition, t.name] })],
)

export type AgsDictionary = typeof agsDictionaries.$inferSelect
export type NewAgsDictionary = typeof agsDictionaries.$inferInsert
export type AgsDictionaryGroup = typeof agsDictionaryGroups.$inferSelect
export type NewAgsDictionaryGroup = typeof agsDictionaryGroups.$inferInsert

const edition = (s: z.ZodString) =>
  s.trim().regex(AGS_EDITION_FORM, 'an AGS4 edition such as 4.1.1')

/** The fields of `POST /api/ags/dictionaries` besides the file: the edition, if TRAN_AGS lacks it. */
export const AgsDictionaryUploadFields = createInsertSchema(agsDictionaries, { edition })
  .pick({ edition: true })
  .partial()
  .strict()

/** `/api/ags/dictionaries/:edition`. */
export const AgsEditionParam = z.object({ edition: edition(z.string()) }).strict()
