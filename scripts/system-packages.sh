#!/usr/bin/env bash
# The Debian packages the tests need, installed when missing (run by `npm test` through its pretest step, and so by
# .ci/run): chromium (browser tests), python3-scikit-rf, python3-ezdxf and python3-scipy (reference tests, under Debian's own
# python3), libxml2-utils (xmllint) and poppler-utils (pdfinfo, pdftoppm) for the export checks.
# Says what it installs and why. As root it runs apt-get itself; otherwise through `sudo -n` when that needs no
# password; else it prints the command to run and stops. SYSTEM_PACKAGES_DRY_RUN=1 only reports.
set -euo pipefail
DEBIAN_PATH="$(getconf PATH)"
need=()
why=()
command -v chromium >/dev/null 2>&1 || { need+=(chromium); why+=("chromium: the browser tests"); }
PATH="$DEBIAN_PATH" python3 -c 'import skrf' >/dev/null 2>&1 || { need+=(python3-scikit-rf); why+=("python3-scikit-rf: reference tests (line, network, Touchstone)"); }
PATH="$DEBIAN_PATH" python3 -c 'import ezdxf' >/dev/null 2>&1 || { need+=(python3-ezdxf); why+=("python3-ezdxf: the DXF export oracle"); }
PATH="$DEBIAN_PATH" python3 -c 'import scipy.stats, scipy.special' >/dev/null 2>&1 || { need+=(python3-scipy); why+=("python3-scipy: the yield statistics checks (normal quantiles, intervals)"); }
command -v xmllint >/dev/null 2>&1 || { need+=(libxml2-utils); why+=("libxml2-utils: xmllint for the SVG export check"); }
command -v pdftoppm >/dev/null 2>&1 || { need+=(poppler-utils); why+=("poppler-utils: pdfinfo and pdftoppm for the PDF mask check"); }

if ((${#need[@]} == 0)); then
  echo "system packages: all present (chromium, python3-scikit-rf, python3-ezdxf, python3-scipy, libxml2-utils, poppler-utils)"
  exit 0
fi
echo "system packages: installing ${need[*]}"
for w in "${why[@]}"; do echo "  - $w"; done
if [[ "${SYSTEM_PACKAGES_DRY_RUN:-}" == 1 ]]; then echo "system packages: dry run, nothing installed"; exit 0; fi
if [[ "$(id -u)" == 0 ]]; then as_root=(); elif command -v sudo >/dev/null 2>&1 && sudo -n true 2>/dev/null; then as_root=(sudo -n); else
  echo "system packages: cannot install without administrator rights; run this, then npm test again:" >&2
  echo "  sudo apt-get update && sudo apt-get install -y --no-install-recommends ${need[*]}" >&2
  exit 1
fi
export DEBIAN_FRONTEND=noninteractive
"${as_root[@]}" apt-get update -qq
"${as_root[@]}" apt-get install -y --no-install-recommends "${need[@]}" >/dev/null
echo "system packages: installed ${need[*]}"
