/**
 * The built page must carry the strict policy in a meta tag, identical to the one the shell and
 * the host use. Directive meanings per the W3C Content Security Policy Level 3 recommendation;
 * the requirement is the Electron security checklist's "Define a Content Security Policy".
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { CONTENT_SECURITY_POLICY } from '../../electron/shell/csp.js';

const builtIndex = path.resolve(import.meta.dirname, '../../dist/renderer/index.html');

function metaPolicies(html: string): string[] {
  const out: string[] = [];
  for (const tag of html.match(/<meta\b[^>]*>/gi) ?? []) {
    if (!/http-equiv\s*=\s*["']?Content-Security-Policy["']?/i.test(tag)) continue;
    const content = /content\s*=\s*"([^"]*)"|content\s*=\s*'([^']*)'/i.exec(tag);
    if (content) out.push((content[1] ?? content[2] ?? '').replace(/&#39;|&apos;/g, "'").replace(/&quot;/g, '"').replace(/&amp;/g, '&'));
  }
  return out;
}

function directives(policy: string): Map<string, string[]> {
  const map = new Map<string, string[]>();
  for (const part of policy.split(';')) {
    const [name, ...values] = part.trim().split(/\s+/);
    if (name) map.set(name.toLowerCase(), values);
  }
  return map;
}

describe('content security policy', () => {
  it('the policy string blocks everything not ours', () => {
    const d = directives(CONTENT_SECURITY_POLICY);
    expect(d.get('default-src')).toEqual(["'none'"]);
    expect(d.get('script-src')).toEqual(["'self'"]); // no 'unsafe-inline', no 'unsafe-eval'
    expect(d.get('object-src')).toEqual(["'none'"]);
    expect(d.get('base-uri')).toEqual(["'none'"]);
    expect(d.get('form-action')).toEqual(["'none'"]);
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/unsafe-|\*|https?:/);
  });

  it('the built index.html carries exactly that policy in one meta tag', () => {
    if (!existsSync(builtIndex)) {
      throw new Error(`${builtIndex} is missing: run npm run build:renderer first.`);
    }
    const html = readFileSync(builtIndex, 'utf8');
    const policies = metaPolicies(html);
    expect(policies).toHaveLength(1);
    expect(directives(policies[0]!)).toEqual(directives(CONTENT_SECURITY_POLICY));
    expect(policies[0]!.trim().replace(/;\s*$/, '')).toBe(CONTENT_SECURITY_POLICY);
  });

  it('the built page has no inline script the policy would have to allow', () => {
    if (!existsSync(builtIndex)) throw new Error(`${builtIndex} is missing: run npm run build:renderer first.`);
    const html = readFileSync(builtIndex, 'utf8');
    for (const tag of html.match(/<script\b[^>]*>/gi) ?? []) expect(tag).toMatch(/\bsrc\s*=/i);
    expect(html).not.toMatch(/\son[a-z]+\s*=/i);
  });
});
