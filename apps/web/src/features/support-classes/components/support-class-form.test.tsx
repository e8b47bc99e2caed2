import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SupportClassForm } from '@/features/support-classes/components/support-class-form';
import { saveSession } from '@/lib/session';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

function renderForm() {
  renderWithProviders(<SupportClassForm projectId="p-1" onSaved={jest.fn()} onCancel={jest.fn()} />);
}

describe('SupportClassForm', () => {
  it('mirrors the server rules for ranges and round length', async () => {
    const api = mockApi({});
    const user = userEvent.setup();
    renderForm();
    await user.type(screen.getByLabelText(/^Code/), 'SC 9');
    await user.type(screen.getByLabelText(/^Maximum round length/), '9');
    await user.click(screen.getByRole('button', { name: 'Add class' }));
    expect(
      await screen.findByText('Use up to 20 letters, digits, dots, slashes or dashes.'),
    ).toBeInTheDocument();
    expect(screen.getByText('Give a Q range, an RMR89 range, or both.')).toBeInTheDocument();
    expect(screen.getByText('Maximum round length is 0.3 to 8 m.')).toBeInTheDocument();

    await user.type(screen.getByLabelText(/^Q from/), '4');
    await user.type(screen.getByLabelText(/^Q below/), '1');
    await user.type(screen.getByLabelText(/^RMR89 from/), '40.5');
    await user.click(screen.getByRole('button', { name: 'Add class' }));
    expect(await screen.findByText('The upper Q bound must be above the lower one.')).toBeInTheDocument();
    expect(screen.getByText('RMR89 is a whole number, 0 to 100.')).toBeInTheDocument();
    expect(api).not.toHaveBeenCalled();
  });

  it('puts the code clash from the server on the code field', async () => {
    mockApi({
      'POST /api/projects/p-1/support-classes': () =>
        jsonResponse(
          {
            code: 'CONFLICT',
            message: 'A support class with code SC-B already exists.',
            fields: { code: 'This code is already used.' },
          },
          409,
        ),
    });
    const user = userEvent.setup();
    renderForm();
    await user.type(screen.getByLabelText(/^Code/), 'SC-B');
    await user.type(screen.getByRole('textbox', { name: /^Name/ }), 'Systematic bolting');
    await user.type(screen.getByLabelText(/^RMR89 from/), '41');
    await user.type(screen.getByLabelText(/^RMR89 to/), '60');
    await user.type(screen.getByLabelText(/^Maximum round length/), '3');
    await user.click(screen.getByRole('button', { name: 'Add class' }));
    expect(await screen.findByText('This code is already used.')).toBeInTheDocument();
    expect(screen.getByLabelText(/^Code/)).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText('Not saved')).toBeInTheDocument();
  });
});
