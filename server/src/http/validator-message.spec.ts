import { describe, expect, it } from 'vitest';
import { plainValidatorMessage } from './validator-message.js';

// ajv's English messages as express-openapi-validator passes them on (ajv's own wording, as it prints it)
describe('plainValidatorMessage', () => {
  it('words lengths, counts and ranges plainly', () => {
    expect(plainValidatorMessage('must NOT have fewer than 1 characters')).toBe('must not be empty');
    expect(plainValidatorMessage('must NOT have fewer than 10 characters')).toBe('must have at least 10 characters');
    expect(plainValidatorMessage('must NOT have more than 120 characters')).toBe('must have at most 120 characters');
    expect(plainValidatorMessage('must NOT have fewer than 1 items')).toBe('must have at least one item');
    expect(plainValidatorMessage('must NOT have more than 20 items')).toBe('must have at most 20 items');
    expect(plainValidatorMessage('must be >= 60')).toBe('must be at least 60');
    expect(plainValidatorMessage('must be <= 86400')).toBe('must be at most 86400');
    expect(plainValidatorMessage('must be > 0')).toBe('must be greater than 0');
  });

  it('words formats, enums and missing fields', () => {
    expect(plainValidatorMessage('must match format "email"')).toBe('must be an e-mail address');
    expect(plainValidatorMessage('must match format "date-time"')).toMatch(/^must be a date and time/);
    expect(plainValidatorMessage('must match format "hostname"')).toBe('must be a valid hostname');
    expect(plainValidatorMessage('must be equal to one of the allowed values: admin, engineer, viewer')).toBe('must be one of admin, engineer, viewer');
    expect(plainValidatorMessage("must have required property 'password'")).toBe('needs "password"');
  });

  it('keeps a message it does not know', () => {
    expect(plainValidatorMessage('must be number')).toBe('must be number');
    expect(plainValidatorMessage("Unknown query parameter 'colour'")).toBe("Unknown query parameter 'colour'");
  });
});
