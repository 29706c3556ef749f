import { act, fireEvent, render, screen } from '@testing-library/react-native';
import { Pressable, Text } from 'react-native';
import { DONE_TOAST_MS, ToastProvider, useToast } from '@/components/ui/toast';

function Actions() {
  const toast = useToast();
  return (
    <>
      <Pressable testID="save" onPress={() => toast('Saved: your display name.')}><Text>save</Text></Pressable>
      <Pressable testID="fail" onPress={() => toast('Not saved: the server could not be reached.', 'error')}><Text>fail</Text></Pressable>
    </>
  );
}

describe('toasts', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('keeps both live regions in the page while empty (a later message is announced)', () => {
    render(<ToastProvider><Actions /></ToastProvider>);
    expect(screen.getByTestId('toast-region-done').props.role).toBe('status');
    expect(screen.getByTestId('toast-region-done').props['aria-live']).toBe('polite');
    expect(screen.getByTestId('toast-region-error').props.role).toBe('alert');
    expect(screen.queryByTestId('toast-done')).toBeNull();
  });

  it('shows a confirmation in the status region and takes it away after a while', () => {
    render(<ToastProvider><Actions /></ToastProvider>);
    fireEvent.press(screen.getByTestId('save'));
    expect(screen.getByTestId('toast-done')).toHaveTextContent(/Saved: your display name\./);
    act(() => jest.advanceTimersByTime(DONE_TOAST_MS - 100));
    expect(screen.queryByTestId('toast-done')).not.toBeNull();
    act(() => jest.advanceTimersByTime(200));
    expect(screen.queryByTestId('toast-done')).toBeNull();
  });

  it('keeps an error until it is dismissed, with a named dismiss button', () => {
    render(<ToastProvider><Actions /></ToastProvider>);
    fireEvent.press(screen.getByTestId('fail'));
    act(() => jest.advanceTimersByTime(DONE_TOAST_MS * 4));
    expect(screen.getByTestId('toast-error')).toHaveTextContent(/Not saved/);
    const dismiss = screen.getByLabelText('Dismiss: Not saved: the server could not be reached.');
    fireEvent.press(dismiss);
    expect(screen.queryByTestId('toast-error')).toBeNull();
  });

  it('does not stack copies of the same message', () => {
    render(<ToastProvider><Actions /></ToastProvider>);
    fireEvent.press(screen.getByTestId('save'));
    fireEvent.press(screen.getByTestId('save'));
    expect(screen.getAllByTestId('toast-done')).toHaveLength(1);
  });

  it('is silent outside a provider instead of throwing', () => {
    render(<Actions />);
    expect(() => fireEvent.press(screen.getByTestId('save'))).not.toThrow();
  });
});
