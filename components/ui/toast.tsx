import { createContext, useCallback, useContext, useEffect, useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';
import { useWideLayout } from './use-wide-layout';

export type ToastKind = 'done' | 'error';

interface Toast {
  id: number;
  kind: ToastKind;
  message: string;
}

type ShowToast = (message: string, kind?: ToastKind) => void;

const ToastContext = createContext<ShowToast | null>(null);

/** How long a confirmation stays; errors stay until dismissed (the person may need to read them twice). */
export const DONE_TOAST_MS = 5000;

/**
 * Short confirmations ("Saved", "Odile Ferrant is now a curator") and errors of actions, announced by
 * screen readers: confirmations through a polite status region, errors through an alert region. Both
 * regions stay in the page while empty, so a message added later is announced.
 */
export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<Toast[]>([]);
  const wide = useWideLayout();

  const dismiss = useCallback((id: number) => {
    setToasts((list) => list.filter((toast) => toast.id !== id));
  }, []);

  const show = useCallback<ShowToast>((message, kind = 'done') => {
    const id = nextToastId++;
    // The same message again replaces the older one rather than stacking a copy.
    setToasts((list) => [...list.filter((toast) => toast.message !== message), { id, kind, message }].slice(-3));
  }, []);

  const regions = (['done', 'error'] as const).map((kind) => (
    <View
      key={kind}
      role={kind === 'error' ? 'alert' : 'status'}
      aria-live={kind === 'error' ? 'assertive' : 'polite'}
      accessibilityLiveRegion={kind === 'error' ? 'assertive' : 'polite'}
      style={styles.region}
      pointerEvents="box-none"
      testID={`toast-region-${kind}`}
    >
      {toasts
        .filter((toast) => toast.kind === kind)
        .map((toast) => (
          <ToastRow key={toast.id} toast={toast} onDismiss={dismiss} />
        ))}
    </View>
  ));

  return (
    <ToastContext.Provider value={show}>
      {children}
      <View style={[styles.stack, wide ? styles.stackWide : styles.stackPhone]} pointerEvents="box-none">
        {regions}
      </View>
    </ToastContext.Provider>
  );
}

let nextToastId = 1;

function ToastRow({ toast, onDismiss }: { toast: Toast; onDismiss: (id: number) => void }) {
  const { id, kind, message } = toast;
  useEffect(() => {
    if (kind !== 'done') return undefined;
    const timer = setTimeout(() => onDismiss(id), DONE_TOAST_MS);
    return () => clearTimeout(timer);
  }, [id, kind, onDismiss]);
  return (
    <View style={[styles.toast, kind === 'error' ? styles.error : styles.done]} testID={`toast-${kind}`}>
      <AppText style={styles.message}>{message}</AppText>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={`Dismiss: ${message}`}
        onPress={() => onDismiss(id)}
        style={styles.close}
        testID="toast-dismiss"
      >
        <AppText style={styles.closeText} aria-hidden>
          ×
        </AppText>
      </Pressable>
    </View>
  );
}

/** `const toast = useToast(); toast('Saved')` or `toast('Could not save: …', 'error')`. */
export function useToast(): ShowToast {
  const show = useContext(ToastContext);
  // Outside the provider (a component rendered alone in a test) a toast is simply not shown.
  return show ?? noToast;
}

const noToast: ShowToast = () => undefined;

const styles = StyleSheet.create({
  stack: { position: 'absolute', gap: spacing.sm, zIndex: 10 },
  // Above the bottom tab bar on a phone; top right, clear of the rail, on a wide screen.
  stackPhone: { left: spacing.md, right: spacing.md, bottom: 76 },
  stackWide: { right: spacing.xl, top: spacing.xl, width: 380 },
  region: { gap: spacing.sm },
  toast: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    borderRadius: radius.md,
    borderWidth: 1,
    paddingLeft: spacing.lg,
    shadowColor: '#000000',
    shadowOpacity: 0.12,
    shadowRadius: 12,
    shadowOffset: { width: 0, height: 4 },
  },
  done: { backgroundColor: colors.card, borderColor: colors.accent, borderLeftWidth: 4 },
  error: { backgroundColor: colors.dangerSoft, borderColor: colors.danger, borderLeftWidth: 4 },
  message: { flex: 1, color: colors.ink, paddingVertical: spacing.md },
  close: { width: 44, height: 44, alignItems: 'center', justifyContent: 'center' },
  closeText: { fontSize: 22, lineHeight: 24, color: colors.inkSoft },
});
