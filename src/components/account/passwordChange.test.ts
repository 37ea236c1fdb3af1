import { describe, expect, it } from 'vitest';
import { ApiError } from '@/src/api/client';
import { checkPasswordChange, passwordErrorsFromServer } from './passwordChange';

describe('checkPasswordChange', () => {
  it('accepts a sound new password typed twice', () => {
    expect(checkPasswordChange('old-password-1', 'a-sound-new-one', 'a-sound-new-one')).toEqual({});
  });

  it('uses the shared rule: common, short, over 72 bytes, same as before', () => {
    expect(checkPasswordChange('old', 'qwertyuiop', 'qwertyuiop').newPassword).toMatch(/most used passwords/);
    expect(checkPasswordChange('old', 'short', 'short').newPassword).toMatch(/at least 10 characters/);
    expect(checkPasswordChange('old', 'é'.repeat(37), 'é'.repeat(37)).newPassword).toMatch(/at most 72 bytes/);
    expect(checkPasswordChange('same-password-1', 'same-password-1', 'same-password-1').newPassword).toMatch(/differ/);
    expect(checkPasswordChange('', 'a-sound-new-one', 'a-sound-new-one').currentPassword).toMatch(/current password/);
  });

  it('asks for the same new password twice', () => {
    expect(checkPasswordChange('old', 'a-sound-new-one', 'a-sound-new-two')).toEqual({ repeat: 'The two new passwords are not the same.' });
  });
});

describe('passwordErrorsFromServer', () => {
  it('puts a wrong current password beside its field, anything else above the form', () => {
    const wrong = new ApiError(400, 'wrong-password', 'The current password is not right.', [{ field: 'currentPassword', message: 'The current password is not right.' }]);
    expect(passwordErrorsFromServer(wrong)).toEqual({ currentPassword: 'The current password is not right.' });
    expect(passwordErrorsFromServer(new ApiError(0, 'network', 'Could not reach the Headwater server.'))).toEqual({ form: 'Could not reach the Headwater server.' });
  });
});
