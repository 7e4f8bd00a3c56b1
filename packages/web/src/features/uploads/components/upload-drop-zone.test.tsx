import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { UploadDropZone } from './upload-drop-zone';

afterEach(cleanup);

const log = (name: string) => new File(['time,lat,lon\n'], name, { type: 'text/csv' });

describe('UploadDropZone', () => {
  it('takes many dropped files at once', () => {
    const onFiles = vi.fn();
    render(<UploadDropZone onFiles={onFiles} />);
    const zone = screen.getByRole('region', { name: 'Drop log files' });
    fireEvent.drop(zone, { dataTransfer: { files: [log('a.csv'), log('b.gpx')] } });
    expect(onFiles).toHaveBeenCalledTimes(1);
    expect(onFiles.mock.calls[0]?.[0].map((f: File) => f.name)).toEqual(['a.csv', 'b.gpx']);
  });

  it('takes files chosen with the labelled file input, and nothing while disabled', () => {
    const onFiles = vi.fn();
    const { rerender } = render(<UploadDropZone onFiles={onFiles} />);
    const input = screen.getByLabelText('Choose log files') as HTMLInputElement;
    expect(input.type).toBe('file');
    expect(input.multiple).toBe(true);
    fireEvent.change(input, { target: { files: [log('c.nmea')] } });
    expect(onFiles).toHaveBeenCalledTimes(1);
    rerender(<UploadDropZone onFiles={onFiles} disabled />);
    fireEvent.drop(screen.getByRole('region', { name: 'Drop log files' }), {
      dataTransfer: { files: [log('d.csv')] },
    });
    expect(onFiles).toHaveBeenCalledTimes(1);
    expect((screen.getByLabelText('Choose log files') as HTMLInputElement).disabled).toBe(true);
  });
});
