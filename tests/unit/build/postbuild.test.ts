import { describe, expect, it } from 'vitest';
import { hashSource, headersFile, inlineScripts, nginxHeaderLines, pageRoutes, scriptHashes } from '../../../scripts/postbuild.mjs';
import { contentSecurityPolicy, SCRIPT_HASHES_PLACEHOLDER, securityHeaders } from '../../../scripts/security-headers.mjs';

describe('inline script hashes for the Content Security Policy (scripts/postbuild.mjs)', () => {
  it('takes the text of inline scripts only, exactly as written', () => {
    const html = '<head><script src="/a.js" async=""></script><script>self.x=1</script></head><body><script id="_R_">\n a < b </script><script type="module" src="/b.js"></script></body>';
    expect(inlineScripts(html)).toEqual(['self.x=1', '\n a < b ']);
  });

  it('hashes with SHA-256 in base64, as CSP hash-sources are written', () => {
    // FIPS 180-4 test vectors (from memory; the base64 forms checked with `openssl dgst -sha256 -binary | base64`):
    // SHA-256("") = e3b0c442…b855, SHA-256("abc") = ba7816bf…15ad.
    expect(hashSource('')).toBe("'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='");
    expect(hashSource('abc')).toBe("'sha256-ungWv48Bz+pBQUDeXa4iI7ADYaOWF3qctBD/YfIAFa0='");
  });

  it('lists each script once across pages, sorted', () => {
    const hashes = scriptHashes(['<script>abc</script><script></script>', '<script>abc</script>']);
    expect(hashes).toEqual([hashSource(''), hashSource('abc')].sort());
    expect(hashes).toHaveLength(2);
  });
});

describe('pages to precache, found in the build (a page added later is picked up)', () => {
  it('maps built files to addresses and leaves out error pages', () => {
    expect(pageRoutes(['index.html', 'handout.html', 'checkups.html', 'a/b.html', 'a/index.html', '404.html', '_not-found.html', '_global-error.html', 'index.txt'])).toEqual({
      '/': 'index.html',
      '/handout': 'handout.html',
      '/checkups': 'checkups.html',
      '/a/b': 'a/b.html',
      '/a': 'a/index.html',
    });
  });
});

describe('the security headers (scripts/security-headers.mjs)', () => {
  it('allows inline scripts in production by hash only: no unsafe-inline, no unsafe-eval', () => {
    const csp = contentSecurityPolicy({ production: true, scriptHashes: ["'sha256-AAAA'"] });
    const scriptSrc = csp.split('; ').find((d) => d.startsWith('script-src'));
    expect(scriptSrc).toBe("script-src 'self' 'sha256-AAAA'");
    expect(csp).not.toContain('unsafe-eval');
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("worker-src 'self'");
    expect(csp).toContain("manifest-src 'self'");
  });

  it('leaves a placeholder (allowing no inline script) until the build has been hashed', () => {
    const csp = contentSecurityPolicy({ production: true, scriptHashes: null });
    expect(csp).toContain(`script-src 'self' ${SCRIPT_HASHES_PLACEHOLDER};`);
    expect(csp.split('; ').find((d) => d.startsWith('script-src'))).not.toContain('unsafe-inline');
  });

  it('writes nginx lines with `always`, so error responses carry the headers too', () => {
    const lines = nginxHeaderLines(securityHeaders({ production: true, scriptHashes: [] })).trim().split('\n');
    expect(lines).toHaveLength(6);
    for (const line of lines) expect(line).toMatch(/^add_header [A-Za-z-]+ ".*" always;$/);
    expect(headersFile([{ key: 'X-A', value: '1' }])).toBe('/*\n  X-A: 1\n');
  });
});
