import { describe, expect, it } from 'vitest';
import type { ModelStatic, Model } from 'sequelize';
import { db } from '@/lib/db';
import * as models from '@/models';
import { useTestApp } from '../../helpers/app';

/**
 * Every column of every model stores what was written to it: a distinct value goes into each
 * attribute, and the row read back through the model (and straight from the table) must hold
 * each value under its own attribute. Several attributes sharing one definition object once
 * made Sequelize map them all onto one column, so an appraisal's five certainty domains all
 * held the last one's value.
 */

useTestApp();

const all = (Object.values(models) as unknown[]).filter(
  (m): m is ModelStatic<Model> =>
    typeof m === 'function' && typeof (m as ModelStatic<Model>).getAttributes === 'function',
);

type Attr = ReturnType<ModelStatic<Model>['getAttributes']>[string];

/** A value for `attr` that differs from every other attribute's value in the same row. */
function valueFor(name: string, attr: Attr, index: number, pass: number): unknown {
  const type = (attr.type as { key?: string }).key ?? String(attr.type);
  const length = (attr.type as { options?: { length?: number } }).options?.length;
  switch (type) {
    case 'STRING':
    case 'TEXT':
    case 'CHAR': {
      const text = `${name}-${index}-${pass}`;
      return length ? text.slice(-length) : text;
    }
    case 'INTEGER':
    case 'BIGINT':
      return 1000 + index * 10 + pass;
    case 'FLOAT':
    case 'DOUBLE':
    case 'REAL':
    case 'DECIMAL':
      return 0.125 + index + pass;
    case 'BOOLEAN':
      // Booleans have two values only: pass k sets bit k of the attribute's index, so any two
      // booleans differ in at least one pass.
      return ((index >> pass) & 1) === 1;
    case 'DATE':
      return new Date(Date.UTC(2026, 0, 1 + index, pass));
    case 'JSON':
      return { attribute: name, index, pass };
    default:
      throw new Error(`No test value for ${name}: ${type}`);
  }
}

function comparable(v: unknown): unknown {
  if (v instanceof Date) return v.toISOString();
  return v;
}

describe('every model stores each attribute in its own column', () => {
  it('finds the models', () => {
    expect(all.length).toBeGreaterThanOrEqual(15);
  });

  for (const model of all) {
    it(`${model.name} (${model.getTableName()})`, async () => {
      const attributes = Object.entries(model.getAttributes()).filter(([, a]) => !a.autoIncrement);
      const booleans = attributes.filter(([, a]) => (a.type as { key?: string }).key === 'BOOLEAN').length;
      const passes = Math.max(1, Math.ceil(Math.log2(Math.max(2, booleans))));
      // Foreign keys point at rows this test does not create; the check is about columns only.
      // SQLite: off for the connection. PostgreSQL: off for one transaction (triggers, which
      // enforce them, do not fire in replica mode), rolled back at the end.
      const postgres = db().getDialect() === 'postgres';
      const transaction = postgres ? await db().transaction() : undefined;
      if (transaction) await db().query('SET LOCAL session_replication_role = replica', { transaction });
      else await db().query('PRAGMA foreign_keys = OFF');
      try {
        for (let pass = 0; pass < passes; pass++) {
          const values: Record<string, unknown> = {};
          attributes.forEach(([name, attr], index) => {
            values[name] = valueFor(name, attr, index, pass);
          });
          const created = await model.unscoped().create(values, { silent: true, validate: false, transaction });
          // Most tables key on an integer id; a few on a natural key (sign_in_throttles.key).
          const key = model.primaryKeyAttribute;
          const id = created.get(key) as number | string;
          const back = (await model.unscoped().findByPk(id, { transaction }))!.get({ plain: true }) as Record<
            string,
            unknown
          >;
          const [[raw]] = (await db().query(`SELECT * FROM ${model.getTableName()} WHERE "${key}" = :id`, {
            replacements: { id },
            transaction,
          })) as [Record<string, unknown>[], unknown];
          for (const [name, attr] of attributes) {
            if (name === 'updatedAt' || name === 'createdAt') continue;
            expect(comparable(back[name]), `${model.name}.${name} read through the model`).toEqual(
              comparable(values[name]),
            );
            expect(raw, `${model.name} has a column for ${name}`).toHaveProperty(attr.field ?? name);
            expect(attr.field ?? name, `${model.name}.${name} maps to its own column`).toBe(name);
          }
        }
      } finally {
        await transaction?.rollback();
      }
    });
  }
});
