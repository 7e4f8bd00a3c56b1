import { parseResolveSetup } from '@leadline/core';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../../lib/api-client';
import { ReprocessForm } from './reprocess-form';

afterEach(cleanup);

function type(label: string | RegExp, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

describe('ReprocessForm', () => {
  it('sends the chosen profile without a setup when re-solving is off', async () => {
    const onSubmit = vi.fn();
    render(<ReprocessForm currentProfile="inspection-rov" onSubmit={onSubmit} />);
    expect((screen.getByLabelText('Audit profile') as HTMLSelectElement).value).toBe('inspection-rov');
    expect(screen.queryByLabelText('Logged sound speed (m/s)')).toBeNull();
    fireEvent.change(screen.getByLabelText('Audit profile'), { target: { value: 'work-rov' } });
    fireEvent.click(screen.getByRole('button', { name: 'Reprocess the dive' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledWith({ auditProfile: 'work-rov', setup: null }));
  });

  it('says beside each field what a re-solve still needs, and sends nothing', async () => {
    const onSubmit = vi.fn();
    render(<ReprocessForm currentProfile="diver" onSubmit={onSubmit} />);
    fireEvent.click(screen.getByLabelText(/Re-solve the positions/));
    type('Logged sound speed (m/s)', '');
    fireEvent.click(screen.getByLabelText('From temperature and salinity'));
    fireEvent.click(screen.getByLabelText('A fixed surveyed position'));
    fireEvent.click(screen.getByRole('button', { name: 'Reprocess the dive' }));
    expect(await screen.findByText('Enter the sound speed the system logged with.')).toBeTruthy();
    expect(screen.getByText('Enter the water temperature.')).toBeTruthy();
    expect(screen.getByText('Enter the salinity (0 for fresh water).')).toBeTruthy();
    expect(screen.getByText('Enter the surveyed latitude.')).toBeTruthy();
    expect(screen.getByLabelText('Temperature (°C)').getAttribute('aria-invalid')).toBe('true');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('refuses numbers out of range or not numbers at all', async () => {
    const onSubmit = vi.fn();
    render(<ReprocessForm currentProfile="diver" onSubmit={onSubmit} />);
    fireEvent.click(screen.getByLabelText(/Re-solve the positions/));
    type('Logged sound speed (m/s)', '15OO');
    fireEvent.click(screen.getByLabelText('A measured speed'));
    type('Water sound speed (m/s)', '340');
    type('Heading offset (°)', '270');
    fireEvent.click(screen.getByRole('button', { name: 'Reprocess the dive' }));
    expect(await screen.findByText('The logged sound speed: enter a number, e.g. 1.5.')).toBeTruthy();
    expect(screen.getByText('The water sound speed must be between 1300 and 1700 m/s.')).toBeTruthy();
    expect(screen.getByText('The heading offset must be between -180 and 180 °.')).toBeTruthy();
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it("builds a setup that core's re-solve accepts: T/S sound speed, WMM declination, lever arm, fixed surface", async () => {
    const onSubmit = vi.fn();
    render(<ReprocessForm currentProfile="work-rov" onSubmit={onSubmit} />);
    fireEvent.click(screen.getByLabelText(/Re-solve the positions/));
    type('Logged sound speed (m/s)', '1500');
    fireEvent.click(screen.getByLabelText('From temperature and salinity'));
    type('Temperature (°C)', '8.5');
    type('Salinity (PSU)', '34');
    type('Heading offset (°)', '-1.25');
    fireEvent.click(screen.getByLabelText('Automatic (World Magnetic Model)'));
    type('Forward (x)', '1.2');
    type('Starboard (y)', '-0.4');
    type('Down (z)', '2');
    type('Transceiver draft (m)', '1.5');
    fireEvent.click(screen.getByLabelText('A fixed surveyed position'));
    type('Latitude (° WGS 84)', '59.91');
    type('Longitude (° WGS 84)', '10.72');
    fireEvent.click(screen.getByRole('button', { name: 'Reprocess the dive' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    const request = onSubmit.mock.calls[0]?.[0];
    expect(request.auditProfile).toBe('work-rov');
    const setup = parseResolveSetup(request.setup);
    expect(setup.soundSpeed).toMatchObject({
      loggedMps: 1500,
      water: { method: 'unesco-1983', temperatureC: 8.5, salinityPsu: 34 },
    });
    expect(setup.headingOffset.valueDeg).toBe(-1.25);
    expect(setup.declination.method).toBe('wmm');
    expect(setup.leverArm).toMatchObject({ forwardM: 1.2, starboardM: -0.4, downM: 2 });
    expect(setup.transceiverDraft.valueM).toBe(1.5);
    expect(setup.surfacePosition).toMatchObject({ method: 'fixed', latDeg: 59.91, lonDeg: 10.72 });
  });

  it("shows the server's refusal under the form", () => {
    render(
      <ReprocessForm
        currentProfile="diver"
        onSubmit={vi.fn()}
        error={new ApiError(422, { code: 'unprocessable', message: 'invalid re-solve setup: soundSpeed.loggedMps' })}
      />,
    );
    expect(screen.getByRole('alert').textContent).toBe('invalid re-solve setup: soundSpeed.loggedMps');
  });
});
