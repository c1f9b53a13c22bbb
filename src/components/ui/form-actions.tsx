import { Button } from './button';

/** A form's submit button (saying "Saving…" while it saves) and, when there is somewhere to go back to, Cancel. */
export function FormActions({ saving, submitLabel, onCancel }: { saving: boolean; submitLabel: string; onCancel?: () => void }) {
  return (
    <div className="flex flex-wrap gap-2">
      <Button type="submit" disabled={saving}>
        {saving ? 'Saving…' : submitLabel}
      </Button>
      {onCancel && (
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      )}
    </div>
  );
}
