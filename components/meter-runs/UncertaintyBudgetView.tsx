/**
 * The uncertainty budget of one hourly record, opened from its row: every term of U(qm)/qm with
 * its share (k = 2) and where its input comes from (a standard's clause, a certificate, a datasheet
 * figure and its kind), so an auditor can see what the hour's U rests on.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { space } from '@/constants/theme';
import { budgetRows, type BudgetTerm } from './uncertaintyBudget';

interface UncertaintyBudgetViewProps {
  /** What the budget belongs to, e.g. "hour from 06:00". */
  title: string;
  budget: readonly BudgetTerm[] | null | undefined;
  onClose: () => void;
}

export function UncertaintyBudgetView({ title, budget, onClose }: UncertaintyBudgetViewProps) {
  const rows = budgetRows(budget);
  return (
    <View style={styles.box} testID="uncertainty-budget" accessibilityLabel={`Uncertainty budget, ${title}`}>
      <View style={styles.header}>
        <AppText variant="bodyStrong" style={styles.title}>{`Uncertainty budget, ${title}`}</AppText>
        <Button label="Close" size="compact" variant="quiet" onPress={onClose} testID="uncertainty-budget-close" />
      </View>
      {rows.length ? (
        rows.map((row) => (
          <View key={row.key} style={styles.row} testID={`uncertainty-budget-${row.key}`}>
            <AppText variant="body" style={styles.label}>
              {row.label}
            </AppText>
            <AppText variant="body" style={styles.share}>
              {row.share}
            </AppText>
            <AppText variant="caption" tone="muted" style={styles.source}>
              {row.source}
            </AppText>
          </View>
        ))
      ) : (
        <AppText variant="caption" tone="muted">
          {budget ? 'No flow in this record: nothing to budget.' : 'This record was stored before budgets were kept.'}
        </AppText>
      )}
      <AppText variant="caption" tone="muted">
        Each share is the term&apos;s sensitivity × its input&apos;s expanded uncertainty (k = 2). The hour&apos;s U is
        their root-sum-square (ISO 5167-1:2003 §8, GUM §5.1.2).
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, paddingVertical: space.sm },
  header: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  title: { flexShrink: 1 },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', gap: space.sm },
  label: { minWidth: 220 },
  share: { minWidth: 80 },
  source: { flexShrink: 1, flexBasis: 320, flexGrow: 1 },
});
