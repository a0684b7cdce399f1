// The checks on the job site and the spec tables behind them, in real Chromium.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { PHONE, newSession, screenshot } from '../support/browser';
import { closeTestDb, makeAccount, makeEquipmentModel, makeUser } from '../support/fixtures';
import { signIn } from './helpers';

const GAS_CAUTION_START = 'Gas work is for qualified, licensed technicians only.';

const result = (page: Page) => page.getByRole('region', { name: 'Result' });

describe('checks', () => {
  afterAll(() => closeTestDb());

  it('When a contractor on a phone checks a manifold reading and sizes a pipe, then the verdicts, units and cautions are right', async () => {
    const account = await makeAccount();
    const contractor = await makeUser({ role: 'contractor', accountId: account.id });
    const session = await newSession({ viewport: PHONE });
    try {
      const { page } = session;
      await signIn(page, contractor.email, contractor.password);
      await page.getByRole('link', { name: 'Checks', exact: true }).click();
      await page.getByRole('heading', { level: 1, name: 'Checks' }).waitFor();
      await page.getByText('249.089 Pa (NIST SP 811)').waitFor();

      // Common practice for natural gas: high fire 3.5 ± 0.3 in. w.c. (TYPICAL_SPEC, common practice).
      await page.getByLabel('Manifold, high fire').fill('3.72');
      const item = result(page).locator('[data-item="manifold-high"]');
      await item.getByText('OK', { exact: true }).waitFor();
      expect(await item.getByText('0.22 in. w.c. above target').isVisible()).toBe(true);
      expect(await page.getByTestId('typical-spec').textContent()).toContain('common practice');
      expect(await result(page).getByText(GAS_CAUTION_START).isVisible()).toBe(true);

      // 3.72 in. w.c. × 249.08891 Pa = 926.61 Pa; 0.22 in. w.c. = 54.8 Pa (NIST SP 811, conventional inch of water).
      await page.getByRole('group', { name: 'Pressure' }).getByText('Pa', { exact: true }).click();
      await item.getByText('54.8 Pa above target').waitFor();
      expect(await page.getByLabel('Manifold, high fire').inputValue()).toBe('926.61');
      expect(await item.getByText('OK', { exact: true }).isVisible()).toBe(true);
      await screenshot(page, 'checks-gas-pressure-phone');

      // IFGC 402.4 low-pressure formula, natural gas, 0.5 in. w.c. drop, 40 ft: 1/2 in. carries about
      // 82 cfh and 3/4 in. about 170 cfh, so 100 cfh (100,000 Btu/h at 1,000 Btu/ft³) needs 3/4 in.
      await page.getByRole('link', { name: 'Pipe size', exact: true }).click();
      await page.getByRole('heading', { level: 2, name: 'Pipe size' }).waitFor();
      expect(await page.getByLabel('Allowed pressure drop').inputValue()).toBe('124.54');
      await page.getByLabel('Length', { exact: true }).fill('40');
      await page.getByLabel('Load', { exact: true }).fill('100000');
      await page.getByTestId('pipe-recommended').getByText('3/4 in. recommended').waitFor();
      expect(await result(page).getByText(GAS_CAUTION_START).isVisible()).toBe(true);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        PHONE.width,
      );
      await screenshot(page, 'checks-pipe-size-phone');

      // The gas-pressure form kept what was typed while another check was open.
      await page.getByRole('link', { name: 'Gas pressure', exact: true }).click();
      expect(await page.getByLabel('Manifold, high fire').inputValue()).toBe('926.61');
    } finally {
      await session.close();
    }
  });

  it('When a specialist saves a model’s spec table, then it is there after a reload and the gas check judges against it', async () => {
    const model = await makeEquipmentModel();
    const specialist = await makeUser({ role: 'specialist' });
    const session = await newSession({ viewport: { width: 1280, height: 900 } });
    try {
      const { page } = session;
      await signIn(page, specialist.email, specialist.password);
      await page.getByRole('link', { name: 'Equipment', exact: true }).click();
      await page.getByLabel('Search').fill(model.modelNumber);
      await page.getByRole('link', { name: `Edit spec ${model.modelNumber}` }).click();
      await page.getByRole('heading', { level: 1, name: `${model.brand} ${model.modelNumber}` }).waitFor();

      await page.getByText('Two-stage', { exact: true }).click();
      await page.getByLabel('Input, high fire').fill('60000');
      await page.getByLabel('Input, low fire').fill('80000');
      await page.getByLabel('AFUE').fill('96');
      const gas = page.locator('[data-fuel="natural-gas"]');
      await gas.getByText('Natural gas', { exact: true }).click();
      await gas.getByLabel('Inlet minimum').fill('4.5');
      await gas.getByLabel('Inlet maximum').fill('10.5');
      await gas.getByLabel('Manifold target, high fire').fill('3.6');
      await gas.getByLabel('Tolerance ±, high fire').fill('0.3');
      await gas.getByLabel('Manifold target, low fire').fill('1.7');
      await gas.getByLabel('Tolerance ±, low fire').fill('0.2');
      await page.getByRole('button', { name: 'Save spec table' }).click();
      // Checked in the browser with the shared schema: nothing is sent while it is wrong.
      await page.getByText('Low fire cannot be above high fire').waitFor();

      await page.getByLabel('Input, high fire').fill('80000');
      await page.getByLabel('Input, low fire').fill('52000');
      await page.getByRole('button', { name: 'Save spec table' }).click();
      await page.getByText('Spec table saved.').waitFor();
      await screenshot(page, 'equipment-spec-editor');

      await page.reload();
      await page.getByRole('heading', { level: 1, name: `${model.brand} ${model.modelNumber}` }).waitFor();
      expect(await page.getByLabel('Input, low fire').inputValue()).toBe('52000');
      expect(await page.getByLabel('AFUE').inputValue()).toBe('96');
      expect(await gas.getByLabel('Manifold target, high fire').inputValue()).toBe('3.6');
      expect(await gas.getByLabel('Tolerance ±, low fire').inputValue()).toBe('0.2');

      // The gas-pressure check picks the model and judges against its own target (3.6 ± 0.3).
      await page.getByRole('link', { name: 'Checks', exact: true }).click();
      await page.getByText('An equipment model', { exact: true }).click();
      await page.getByRole('combobox', { name: 'Equipment model' }).fill(model.modelNumber);
      await page.getByRole('option', { name: `${model.brand} ${model.modelNumber}` }).click();
      await page.getByText(`Judged against the spec table of ${model.brand} ${model.modelNumber}`).waitFor();
      await page.getByLabel('Manifold, high fire').fill('3.72');
      const item = result(page).locator('[data-item="manifold-high"]');
      await item.getByText('0.12 in. w.c. above target').waitFor();
      await item.getByText('OK', { exact: true }).waitFor();
      await screenshot(page, 'checks-gas-pressure-desk');

      // The printout: the result, its rule and caution, without the navigation and the controls.
      await page.emulateMedia({ media: 'print' });
      expect(await page.getByRole('navigation', { name: 'Which check' }).isVisible()).toBe(false);
      expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
      expect(await page.getByRole('link', { name: 'Equipment', exact: true }).isVisible()).toBe(false);
      expect(await result(page).getByText(GAS_CAUTION_START).isVisible()).toBe(true);
      await screenshot(page, 'checks-print');
    } finally {
      await session.close();
    }
  });
});
