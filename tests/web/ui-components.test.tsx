import { fireEvent, render, screen } from '@testing-library/react';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ErrorState } from '@/components/ui/error-state';
import { StatusPill } from '@/components/ui/status-pill';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/api/errors';

describe('TextField', () => {
  it('when there is an error, then it shows under the field with an alert role and the field is marked invalid', () => {
    render(<TextField label="E-mail" value="x" onChangeText={() => {}} error="Enter a valid e-mail address" testID="email" />);
    expect(screen.getByTestId('email-error').textContent).toBe('Enter a valid e-mail address');
    expect(screen.getByRole('alert').textContent).toContain('Enter a valid e-mail address');
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
  });

  it('when a password field is revealable, then the eye button toggles the masking', () => {
    render(<TextField label="Password" value="secret" onChangeText={() => {}} secureTextEntry revealable testID="pw" />);
    const input = screen.getByLabelText('Password');
    expect(input.getAttribute('type')).toBe('password');
    fireEvent.click(screen.getByLabelText('Show password'));
    expect(screen.getByLabelText('Password').getAttribute('type')).not.toBe('password');
  });
});

describe('Button', () => {
  it('when busy, then it shows the busy words and ignores presses', () => {
    const onPress = jest.fn();
    render(<Button title="Sign in" busyTitle="Signing in…" busy onPress={onPress} testID="b" />);
    expect(screen.getByTestId('b').textContent).toContain('Signing in…');
    fireEvent.click(screen.getByTestId('b'));
    expect(onPress).not.toHaveBeenCalled();
  });

  it('when pressed, then it calls onPress', () => {
    const onPress = jest.fn();
    render(<Button title="Save" onPress={onPress} />);
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect(onPress).toHaveBeenCalledTimes(1);
  });
});

describe('states are never colour alone', () => {
  it('when a status pill renders, then it carries its word and an icon', () => {
    const { container } = render(<StatusPill label="Returned" icon="returned" tone="due" testID="p" />);
    expect(screen.getByTestId('p').textContent).toBe('Returned');
    expect(container.querySelector('svg')).not.toBeNull();
  });

  it('when an irreversible banner renders, then it is an alert with its words and an icon', () => {
    const { container } = render(<Banner kind="irreversible" title="Cannot be undone" message="Steel is removed." />);
    expect(screen.getByRole('alert').textContent).toContain('Cannot be undone');
    expect(container.querySelector('svg')).not.toBeNull();
  });
});

describe('ChoiceGroup', () => {
  it('when several may be picked, then pressing toggles each value in and out', () => {
    const onChange = jest.fn();
    const options = [
      { value: 'a', label: 'Starling Rangers', code: 'SR' },
      { value: 'b', label: 'Mudlark Racers', code: 'MR' },
    ];
    const { rerender } = render(<ChoiceGroup multiple label="Brands" options={options} value={['a']} onChange={onChange} />);
    expect(screen.getByRole('checkbox', { name: /Starling Rangers/ }).getAttribute('aria-checked')).toBe('true');
    fireEvent.click(screen.getByRole('checkbox', { name: /Mudlark Racers/ }));
    expect(onChange).toHaveBeenLastCalledWith(['a', 'b']);
    rerender(<ChoiceGroup multiple label="Brands" options={options} value={['a', 'b']} onChange={onChange} />);
    fireEvent.click(screen.getByRole('checkbox', { name: /Starling Rangers/ }));
    expect(onChange).toHaveBeenLastCalledWith(['b']);
  });
});

describe('ErrorState', () => {
  it('when the network is down, then it says so and offers a retry', () => {
    const retry = jest.fn();
    render(<ErrorState error={new ApiError(0, 'network', 'Cannot reach Toolgate.')} onRetry={retry} />);
    expect(screen.getByText('No connection')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: /Try again/ }));
    expect(retry).toHaveBeenCalled();
  });
});
