import { screen } from '@testing-library/react';
import { CreateMethodDialog } from '@/features/methods/components/create-method-dialog';
import { renderWithProviders, stubApi } from './render';

describe('new method dialog', () => {
  it('keeps the technique within its 80 characters where it is typed, and says so beside the field', async () => {
    stubApi({ 'GET /api/criteria-templates': { body: [] } });
    const { user } = renderWithProviders(<CreateMethodDialog proposal={false} />);
    await user.click(await screen.findByRole('button', { name: 'New method' }));
    const technique = await screen.findByRole('combobox', { name: /Technique/ });
    await user.type(technique, 'x'.repeat(95));
    expect((technique as HTMLInputElement).value).toHaveLength(80);
    expect(screen.getByText(/up to 80 characters/)).toBeInTheDocument();
  });
});
