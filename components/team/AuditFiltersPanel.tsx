import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { useTeamUsersQuery } from '@/components/api/use-team';
import { useIsWide } from '@/components/layout/use-is-wide';
import { spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { FormSelect } from '@/components/ui/FormSelect';
import { FormTextField } from '@/components/ui/FormTextField';
import { Select } from '@/components/ui/Select';

import { type AuditFilterForm, auditFilterFormSchema, countActiveFilters, EMPTY_AUDIT_FILTER_FORM } from './audit-filter-form';
import { AUDIT_ACTION_OPTIONS, AUDIT_DATE_PRESETS, presetDays } from './audit-sentence';

/** Props of {@link AuditFiltersPanel}. */
export interface AuditFiltersPanelProps {
  value: AuditFilterForm;
  onApply: (value: AuditFilterForm) => void;
}

/** Filters of the audit log (action, object type, person, date range, count); folds away on phones. */
export function AuditFiltersPanel({ value, onApply }: AuditFiltersPanelProps) {
  const wide = useIsWide();
  const [open, setOpen] = useState(wide);
  const users = useTeamUsersQuery();
  const { control, handleSubmit, reset, setValue } = useForm({ resolver: zodResolver(auditFilterFormSchema), defaultValues: value });
  const [preset, setPreset] = useState('');
  const active = countActiveFilters(value);
  const apply = handleSubmit((v) => {
    onApply(v);
    if (!wide) setOpen(false);
  });

  if (!open) {
    return (
      <Button
        label={active ? `Filters (${active})` : 'Filters'}
        icon="filter"
        variant="secondary"
        size="sm"
        onPress={() => setOpen(true)}
      />
    );
  }
  return (
    <Card padding="md">
      <View style={styles.grid} role="form" aria-label="Audit filters">
        <View style={styles.cell}>
          <FormSelect control={control} name="action" label="Action" placeholder="Any action" options={AUDIT_ACTION_OPTIONS} />
        </View>
        <View style={styles.cell}>
          <FormTextField control={control} name="objectType" label="Object type" placeholder="e.g. user" autoCapitalize="none" />
        </View>
        <View style={styles.cell}>
          <FormSelect
            control={control}
            name="actorId"
            label="Done by"
            placeholder="Anyone"
            options={(users.data ?? []).map((u) => ({ value: u.id, label: u.name }))}
          />
        </View>
        <View style={styles.cell}>
          <Select
            label="When"
            placeholder="Any time"
            value={preset}
            onChange={(v) => {
              setPreset(v);
              const p = AUDIT_DATE_PRESETS.find((x) => x.value === v);
              const days = p ? presetDays(p.days) : { since: '', until: '' };
              setValue('since', days.since);
              setValue('until', days.until);
            }}
            options={AUDIT_DATE_PRESETS.map((p) => ({ value: p.value, label: p.label }))}
            hint="Or type the days below"
          />
        </View>
        <View style={styles.cell}>
          <FormTextField control={control} name="since" label="From (UTC day)" placeholder="YYYY-MM-DD" />
        </View>
        <View style={styles.cell}>
          <FormTextField control={control} name="until" label="To (UTC day)" placeholder="YYYY-MM-DD" />
        </View>
        <View style={[styles.cell, styles.narrow]}>
          <FormTextField control={control} name="limit" label="Show newest" unit="events" inputMode="numeric" />
        </View>
      </View>
      <View style={styles.actions}>
        <Button label="Apply filters" icon="filter" size="sm" onPress={() => void apply()} />
        <Button
          label="Clear"
          variant="ghost"
          size="sm"
          onPress={() => {
            reset(EMPTY_AUDIT_FILTER_FORM);
            setPreset('');
            onApply(EMPTY_AUDIT_FILTER_FORM);
          }}
        />
        {!wide ? <Button label="Hide" variant="ghost" size="sm" onPress={() => setOpen(false)} /> : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  cell: { flexGrow: 1, flexBasis: 120, minWidth: 120 },
  narrow: { flexBasis: 110 },
  actions: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
});
