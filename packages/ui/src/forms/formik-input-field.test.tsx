import { FluentProvider } from '@fluentui/react-components';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { Form, Formik } from 'formik';
import { object, string } from 'yup';
import { roundbookLightTheme } from '../theme/theme';
import { FormikInputField } from './formik-input-field';

const schema = object({ chainage: string().required('Give the face chainage.') });

function renderField(onSubmit = jest.fn()) {
  render(
    <FluentProvider theme={roundbookLightTheme}>
      <Formik initialValues={{ chainage: '' }} validationSchema={schema} onSubmit={onSubmit}>
        <Form>
          <FormikInputField name="chainage" label="Face chainage" hint="metres from the portal" />
          <button type="submit">Save</button>
        </Form>
      </Formik>
    </FluentProvider>,
  );
  return onSubmit;
}

describe('FormikInputField', () => {
  it('labels the input and shows the hint', () => {
    renderField();
    expect(screen.getByLabelText('Face chainage')).toHaveValue('');
    expect(screen.getByText('metres from the portal')).toBeInTheDocument();
  });

  it('shows the schema error only after the field is touched', async () => {
    const user = userEvent.setup();
    renderField();
    expect(screen.queryByText('Give the face chainage.')).not.toBeInTheDocument();
    await user.click(screen.getByLabelText('Face chainage'));
    await user.tab();
    expect(await screen.findByText('Give the face chainage.')).toBeInTheDocument();
    expect(screen.getByLabelText('Face chainage')).toHaveAttribute('aria-invalid', 'true');
  });

  it('passes typed values to Formik', async () => {
    const user = userEvent.setup();
    const onSubmit = renderField();
    await user.type(screen.getByLabelText('Face chainage'), '1250.5');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(onSubmit).toHaveBeenCalledWith({ chainage: '1250.5' }, expect.anything());
  });
});

describe('FormikInputField: read only, outside messages, value changes, several lines', () => {
  function renderWith(props: Partial<Parameters<typeof FormikInputField>[0]>, initial = 'Crown only') {
    render(
      <FluentProvider theme={roundbookLightTheme}>
        <Formik initialValues={{ notes: initial }} onSubmit={jest.fn()}>
          <Form>
            <FormikInputField name="notes" label="Notes" {...props} />
          </Form>
        </Formik>
      </FluentProvider>,
    );
    return screen.getByLabelText('Notes');
  }

  it('shows a read-only value that cannot be typed over', async () => {
    const user = userEvent.setup();
    const input = renderWith({ readOnly: true });
    expect(input).toHaveAttribute('readonly');
    await user.type(input, ' and walls');
    expect(input).toHaveValue('Crown only');
  });

  it('shows a message from outside the schema at once, as the field error', () => {
    const input = renderWith({ message: 'Give the length of the next round.' });
    expect(screen.getByText('Give the length of the next round.')).toBeInTheDocument();
    expect(input).toHaveAttribute('aria-invalid', 'true');
  });

  it('shows a warning while there is no error, and the error over it', () => {
    renderWith({ warning: 'Over the planned round length.' });
    expect(screen.getByText('Over the planned round length.')).toBeInTheDocument();
    expect(screen.getByLabelText('Notes')).not.toHaveAttribute('aria-invalid', 'true');
  });

  it('tells the caller each new value after Formik has it', async () => {
    const user = userEvent.setup();
    const onValueChange = jest.fn();
    const input = renderWith({ onValueChange }, '');
    await user.type(input, 'ab');
    expect(onValueChange).toHaveBeenLastCalledWith('ab');
    expect(onValueChange).toHaveBeenCalledTimes(2);
    expect(input).toHaveValue('ab');
  });

  it('is a text area of the given rows when multiline', async () => {
    const user = userEvent.setup();
    const input = renderWith({ multiline: 4 }, '');
    expect(input.tagName).toBe('TEXTAREA');
    expect(input).toHaveAttribute('rows', '4');
    await user.type(input, 'Line one{Enter}Line two');
    expect(input).toHaveValue('Line one\nLine two');
  });
});
