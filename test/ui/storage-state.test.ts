// The storage panel's and backup reminder's rules: the reminder field read as typed (a message
// naming the field and the range for anything else), and when the reminder is due.
import { describe, expect, it } from 'vitest';
import { backupReminder, readReminderDays, reminderDays } from '../../src/ui/state/storage-state.ts';
import { BACKUP_REMINDER, DEFAULT_SETTINGS } from '../../src/ui/state/settings-model.ts';

describe('backup reminder', () => {
  it('reads whole days from 1 to 60 and names the field and the range for anything else', () => {
    expect(readReminderDays('7')).toEqual({ days: 7 });
    expect(readReminderDays(' 60 ')).toEqual({ days: 60 });
    expect(readReminderDays('1')).toEqual({ days: 1 });
    for (const bad of ['0', '61', '', '2.5', '-3', 'seven', '1e1']) {
      expect(readReminderDays(bad)).toEqual({ error: expect.stringMatching(/^Backup reminder: .* from 1 to 60\.$/) });
    }
    expect(reminderDays(DEFAULT_SETTINGS)).toBe(BACKUP_REMINDER.defaultDays);
    expect(reminderDays({ ...DEFAULT_SETTINGS, backupReminderDays: 3 })).toBe(3);
  });

  it('is due when checks were saved and the log never left the device, or left it N or more whole days ago', () => {
    const now = new Date('2026-12-04T12:00:00+01:00');
    expect(backupReminder(null, false, 7, now)).toEqual({ due: false, daysSince: null });
    expect(backupReminder(null, true, 7, now)).toEqual({ due: true, daysSince: null });
    expect(backupReminder('2026-11-27T12:00:00+01:00', true, 7, now)).toEqual({ due: true, daysSince: 7 });
    expect(backupReminder('2026-11-27T12:00:01+01:00', true, 7, now)).toEqual({ due: false, daysSince: 6 });
    // The offset of the stored time is honoured: 11:00Z is 12:00+01:00.
    expect(backupReminder('2026-12-03T11:00:00Z', true, 1, now)).toEqual({ due: true, daysSince: 1 });
  });
});
