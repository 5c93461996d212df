#!/usr/bin/env bash
# Screenshots (headless Chromium, 1280 px wide) of every worked notebook's runner page and of
# Jupyter's own `jupyter nbconvert --to html` export of the same executed notebook, for looking at
# the pages as a reader does (the README's pictures are cut from them).
#
#   notebooks/images/make-screenshots.sh OUT                 # runs every notebook, then shoots
#   notebooks/images/make-screenshots.sh --executed DIR OUT  # reuse DIR from `microtally run ... --out DIR`
#   notebooks/images/make-screenshots.sh --readme OUT        # also refresh the README's two pictures
#
# Writes OUT/run (executed notebooks and runner pages, unless --executed), OUT/nbconvert (the
# exports) and OUT/shots: NAME-run-*.png and NAME-nbconvert-*.png, each as -top (first 1280x900
# screenful), -full (whole page) and -tileNN (1280x1600 pieces). Needs Chromium, Jupyter's nbconvert,
# node >= 20 and npm (Debian: chromium jupyter-nbconvert nodejs); playwright-core is installed from
# the pinned lock file of the live-browser test into OUT/node and drives the system Chromium.
# With --readme the first screenful of notebook 01's runner page and of its export are written to
# notebooks/images/runner-page-01.png and nbconvert-export-01.png (palette-reduced by pngquant when it
# is installed, Debian: pngquant, to keep the repository small).
# The export's math uses Debian's local MathJax (libjs-mathjax) when it is there, since these
# machines have no network beyond the package registries (nbconvert's default loads it from a CDN).
set -euo pipefail

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd -P)"
root="$(cd "$here/../.." && pwd -P)"
executed=""
readme=false
while [[ "${1:-}" == --* ]]; do
  case "$1" in
    --executed) executed="$(cd "${2:?--executed needs a folder}" && pwd -P)"; shift 2 ;;
    --readme) readme=true; shift ;;
    *) echo "make-screenshots: unknown option $1" >&2; exit 64 ;;
  esac
done
out="${1:?usage: make-screenshots.sh [--executed DIR] [--readme] OUT}"
mkdir -p "$out"
out="$(cd "$out" && pwd -P)"

chromium_bin="${MICROTALLY_CHROMIUM:-}"
if [[ -z "$chromium_bin" ]]; then
  for c in /usr/lib/chromium/chromium "$(command -v chromium || true)"; do
    if [[ -n "$c" && -x "$c" ]]; then chromium_bin="$c"; break; fi
  done
fi
for tool in jupyter node npm; do
  command -v "$tool" >/dev/null 2>&1 || { echo "make-screenshots: $tool is not on the PATH (Debian: jupyter-nbconvert, nodejs)" >&2; exit 1; }
done
[[ -n "$chromium_bin" ]] || { echo "make-screenshots: no Chromium found (Debian: chromium; or set MICROTALLY_CHROMIUM)" >&2; exit 1; }

if [[ -z "$executed" ]]; then
  executed="$out/run"
  "$root/toolkit/bin/microtally" run "$root"/notebooks/*.ipynb --out "$executed"
fi

mathjax=()
if [[ -f /usr/share/javascript/mathjax/MathJax.js ]]; then
  mathjax=("--HTMLExporter.mathjax_url=file:///usr/share/javascript/mathjax/MathJax.js?config=TeX-AMS_HTML-full,Safe")
fi
mkdir -p "$out/nbconvert"
JUPYTER_PLATFORM_DIRS=1 jupyter nbconvert --to html "${mathjax[@]}" --output-dir "$out/nbconvert" "$executed"/*.ipynb

node_dir="$out/node"
mkdir -p "$node_dir"
cp "$root/toolkit/kernel/src/test/browser/package.json" "$root/toolkit/kernel/src/test/browser/package-lock.json" \
   "$here/shoot-pages.mjs" "$node_dir/"
if [[ ! -d "$node_dir/node_modules/playwright-core" ]]; then
  (cd "$node_dir" && npm ci --no-audit --no-fund --loglevel=error)
fi

node "$node_dir/shoot-pages.mjs" --chromium "$chromium_bin" --out "$out/shots" --suffix run "$executed"/*.html
node "$node_dir/shoot-pages.mjs" --chromium "$chromium_bin" --out "$out/shots" --suffix nbconvert "$out/nbconvert"/*.html
echo "make-screenshots: pictures in $out/shots"
if $readme; then
  for pair in "run:runner-page-01" "nbconvert:nbconvert-export-01"; do
    src="$out/shots/01-trap-of-bosons-${pair%%:*}-top.png" dst="$here/${pair#*:}.png"
    if command -v pngquant >/dev/null 2>&1; then
      pngquant --force --quality=60-90 --speed 1 --strip --output "$dst" "$src"
    else
      cp "$src" "$dst"
    fi
    echo "make-screenshots: $dst ($(($(stat -c %s "$dst") / 1024)) KiB)"
  done
fi
