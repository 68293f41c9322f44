// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DeletePhotoDialog } from '../delete-photo-dialog';

afterEach(cleanup);

const photo = { id: 'photo-1', thumbUrl: '/api/photos/photo-1/thumb' };

describe('DeletePhotoDialog', () => {
  it('deletes the photo shown and closes once that succeeded', async () => {
    const onDelete = vi.fn().mockResolvedValue(undefined);
    const onClose = vi.fn();
    render(<DeletePhotoDialog photo={photo} consequence="Gone for good." busy={false} error={null} onClose={onClose} onDelete={onDelete} />);
    expect(screen.getByText('Gone for good.')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Delete photo' }));
    await waitFor(() => expect(onClose).toHaveBeenCalledTimes(1));
    expect(onDelete).toHaveBeenCalledWith('photo-1');
  });

  it('stays open when deleting fails, showing the error it is given', async () => {
    const onDelete = vi.fn().mockRejectedValue(new Error('offline'));
    const onClose = vi.fn();
    render(<DeletePhotoDialog photo={photo} consequence="Gone for good." busy={false} error="The server could not be reached." onClose={onClose} onDelete={onDelete} />);
    fireEvent.click(screen.getByRole('button', { name: 'Delete photo' }));
    await waitFor(() => expect(onDelete).toHaveBeenCalledTimes(1));
    expect(onClose).not.toHaveBeenCalled();
    expect(screen.getByText('The server could not be reached.')).toBeTruthy();
  });

  it('"Keep it" closes without deleting', () => {
    const onDelete = vi.fn();
    const onClose = vi.fn();
    render(<DeletePhotoDialog photo={photo} consequence="Gone for good." busy={false} error={null} onClose={onClose} onDelete={onDelete} />);
    fireEvent.click(screen.getByRole('button', { name: 'Keep it' }));
    expect(onClose).toHaveBeenCalledTimes(1);
    expect(onDelete).not.toHaveBeenCalled();
  });
});
