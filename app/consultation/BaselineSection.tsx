'use client';
import { lazy, Suspense } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import type { PopulationTable } from '@/lib/tables/schema';
import { tableNeeds } from '@/lib/tables/lookup';
import { BASELINE_SOURCE_CHOICES, SEX_CHOICES_FOR_FORM } from '@/lib/consultation/choices';
import { RadioField, SelectField, TextField } from './fields';
import type { ConsultationFormValues } from '@/lib/consultation/formValues';

/** Loaded once a table is chosen. */
const LookupSummary = lazy(() => import('./LookupSummary'));

export function BaselineSection({ tables }: { tables: readonly PopulationTable[] }) {
  const { control } = useFormContext<ConsultationFormValues>();
  const [source, tableId, age, sex] = useWatch({ control, name: ['baselineSource', 'tableId', 'person.age', 'person.sex'] });
  const table = source === 'table' ? tables.find((t) => t.id === tableId) : undefined;
  const needs = table ? tableNeeds(table) : undefined;

  return (
    <fieldset className="section">
      <legend className="section__title">
        <span className="section__number">1</span> Baseline: the risk without the exposure
      </legend>
      <RadioField name="baselineSource" legend="Where the baseline comes from" choices={BASELINE_SOURCE_CHOICES} />

      {source === 'table' ? (
        <div className="subsection">
          <SelectField
            name="tableId"
            label="Population table"
            choices={[{ value: '', label: 'Choose a table…' }, ...tables.map((t) => ({ value: t.id, label: t.title }))]}
          />
          {needs?.age || needs?.sex ? (
            <div className="field-row">
              {needs.age ? <TextField name="person.age" label="Age in years" kind="numeric" hint="Whole years; the table groups ages in bands." /> : null}
              {needs.sex ? <SelectField name="person.sex" label="Sex" choices={SEX_CHOICES_FOR_FORM} hint="The table gives women and men separately." /> : null}
            </div>
          ) : null}
          {table ? (
            <TextField
              name="tablePrevalence"
              label="Share of the population exposed (optional)"
              hint="A fraction: 0.3 means 30 in 100. Replaces the table’s own figure; used to take the exposed people out of the table’s average."
            />
          ) : null}
          {table ? (
            <Suspense fallback={<p className="lookup lookup__pending">Looking up the table…</p>}>
              <LookupSummary table={table} person={{ age, sex }} />
            </Suspense>
          ) : null}
        </div>
      ) : (
        <div className="subsection">
          {source === 'risk' ? (
            <div className="field-row">
              <TextField name="riskBaseline.risk" label="Risk" hint="A fraction: 0.08 means 8 in 100." />
              <TextField name="riskBaseline.years" label="Over how many years" />
            </div>
          ) : null}
          {source === 'rate' ? (
            <div className="field-row">
              <TextField name="rateBaseline.rate" label="Events" hint="For example 12 …" />
              <TextField name="rateBaseline.perPersonYears" label="Per how many person-years" hint="… per 1000 person-years." />
            </div>
          ) : null}
          {source === 'population' ? (
            <div className="field-row">
              <TextField name="populationBaseline.populationRisk" label="Population-average risk" hint="A fraction, exposed and unexposed together." />
              <TextField name="populationBaseline.exposurePrevalence" label="Share of the population exposed" hint="A fraction: 0.3 means 30 in 100." />
              <TextField name="populationBaseline.years" label="Over how many years" />
            </div>
          ) : null}
          <div className="field-row">
            <TextField name="person.age" label="Age in years (optional)" kind="numeric" hint="Only to say who “people like you” are in the sentences." />
            <SelectField name="person.sex" label="Sex (optional)" choices={SEX_CHOICES_FOR_FORM} />
          </div>
        </div>
      )}
    </fieldset>
  );
}
