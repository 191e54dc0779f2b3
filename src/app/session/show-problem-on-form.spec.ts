import { HttpErrorResponse } from '@angular/common/http';
import { FormArray, FormControl, FormGroup, Validators } from '@angular/forms';
import { clearServerErrors, showProblemOnForm } from './show-problem-on-form';

// Bodies shaped as server/http/problem.ts validationFailed() writes them (problem+json, RFC 9457; pointers per RFC 6901).
const refusal = (errors: { pointer: string; message: string }[], detail = 'The record has problems.') =>
  new HttpErrorResponse({ status: 422, error: { type: 'about:blank', title: 'Unprocessable', status: 422, detail, errors } });

const form = () =>
  new FormGroup({
    name: new FormControl('Kestrel Bay', { nonNullable: true, validators: Validators.required }),
    address: new FormControl('Unit 4, Quay Road', { nonNullable: true }),
    'a/b': new FormControl('', { nonNullable: true }),
    points: new FormArray([new FormGroup({ label: new FormControl('2182 kHz', { nonNullable: true }) })]),
  });

describe('showProblemOnForm', () => {
  it('puts a field error under the control it names, on a value the browser thought valid', () => {
    const f = form();
    expect(f.valid).toBe(true);
    const banner = showProblemOnForm(f, refusal([{ pointer: '/name', message: 'is already used by another client' }]));
    expect(f.controls.name.getError('server')).toBe('Is already used by another client');
    expect(f.controls.name.touched).toBe(true);
    expect(f.invalid).toBe(true);
    // The product's own wording.
    expect(banner).toBe('Correct the field marked below and try again.');
  });

  it('follows array indices and renamed fields, and takes a pointer deeper than the form to the control above it', () => {
    const f = form();
    const banner = showProblemOnForm(
      f,
      refusal([
        { pointer: '/points/0/label', message: 'must not be empty' },
        { pointer: '/addressLines/6', message: 'must NOT have more than 6 items' },
        { pointer: '/addressLines/7', message: 'a second message for the same field' },
      ]),
      { addressLines: 'address' },
    );
    expect(f.controls.points.at(0).controls.label.getError('server')).toBe('Must not be empty');
    expect(f.controls.address.getError('server')).toBe('Must NOT have more than 6 items');
    expect(banner).toBe('Correct the 2 fields marked below and try again.');
  });

  it('decodes ~1 and ~0 in a pointer (RFC 6901 section 4)', () => {
    const f = form();
    showProblemOnForm(f, refusal([{ pointer: '/a~1b', message: 'is wrong' }]));
    expect(f.controls['a/b'].getError('server')).toBe('Is wrong');
  });

  it('keeps the banner for an error that names no control of the form, or only a group', () => {
    const f = form();
    const banner = showProblemOnForm(f, refusal([{ pointer: '/name', message: 'is taken' }, { pointer: '/code', message: 'must NOT have additional properties' }], 'The client has 2 problems: /name is taken.'));
    expect(f.controls.name.getError('server')).toBe('Is taken');
    expect(banner).toBe('The client has 2 problems: /name is taken.');
    const g = form();
    expect(showProblemOnForm(g, refusal([{ pointer: '/points/0', message: 'must have label' }], 'A point is incomplete.'))).toBe('A point is incomplete.');
    expect(showProblemOnForm(g, refusal([{ pointer: '', message: 'must be object' }], 'The body is not an object.'))).toBe('The body is not an object.');
    expect(g.valid).toBe(true);
  });

  it('answers the problem’s own sentence when there are no field errors, and for network failures', () => {
    const f = form();
    expect(showProblemOnForm(f, new HttpErrorResponse({ status: 409, error: { detail: 'The run was issued meanwhile.' } }))).toBe('The run was issued meanwhile.');
    expect(showProblemOnForm(f, new HttpErrorResponse({ status: 0 }))).toMatch(/cannot be reached/);
    expect(f.valid).toBe(true);
  });

  it('keeps the control’s own validator errors beside the server’s, and drops the server’s when the value changes', () => {
    const f = form();
    f.controls.name.setValue('');
    showProblemOnForm(f, refusal([{ pointer: '/name', message: 'must not be empty' }]));
    expect(f.controls.name.errors).toEqual({ required: true, server: 'Must not be empty' });
    f.controls.name.setValue('Halyard Marine');
    expect(f.controls.name.errors).toBeNull();
  });
});

describe('clearServerErrors', () => {
  it('removes every server message, nested ones too, and keeps the validators’ own', () => {
    const f = form();
    f.controls.name.setValue('');
    showProblemOnForm(f, refusal([{ pointer: '/name', message: 'x' }, { pointer: '/points/0/label', message: 'y' }]));
    clearServerErrors(f);
    expect(f.controls.name.errors).toEqual({ required: true });
    expect(f.controls.points.at(0).controls.label.errors).toBeNull();
    f.controls.name.setValue('Halyard Marine');
    expect(f.valid).toBe(true);
  });
});
