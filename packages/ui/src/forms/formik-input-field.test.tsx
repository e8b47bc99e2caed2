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
