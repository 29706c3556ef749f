import { fireEvent, render, screen } from '@testing-library/react-native';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';

describe('EmptyState', () => {
  it('says what is not here yet', () => {
    render(<EmptyState title="Library — not built yet" body="Arrives with the curated library." />);
    expect(screen.getByText('Library — not built yet')).toBeTruthy();
    expect(screen.getByText('Arrives with the curated library.')).toBeTruthy();
  });
});

describe('Button', () => {
  it('calls onPress when pressed, and not when disabled', () => {
    const onPress = jest.fn();
    const { rerender } = render(<Button label="Check" onPress={onPress} />);
    fireEvent.press(screen.getByRole('button', { name: 'Check' }));
    expect(onPress).toHaveBeenCalledTimes(1);
    rerender(<Button label="Check" onPress={onPress} disabled />);
    fireEvent.press(screen.getByRole('button', { name: 'Check' }));
    expect(onPress).toHaveBeenCalledTimes(1);
  });
});
