#!/usr/bin/env bash
# The whole test suite: formatting, lints, Rust tests without Python, the proof that the core
# has no Python in its dependency tree, a fresh-venv install of the Python package, pytest,
# the stub check and every demo notebook executed headless.
# Usage: bash scripts/test_all.sh        (from anywhere; it installs what it needs)
set -euo pipefail
cd "$(dirname "$0")/.."
export CARGO_TERM_COLOR=never
VENV="${STOCKTANK_VENV:-.venv-test}"
step() { printf '\n==== %s\n' "$*"; }

step "toolchain"
if ! command -v cargo >/dev/null 2>&1; then
  echo "cargo not found: install Rust (rustup) first" >&2
  exit 1
fi
rustup component add rustfmt clippy >/dev/null 2>&1 || true
cargo --version

step "cargo fmt --check"
cargo fmt --check

step "clippy (core, no Python)"
cargo clippy --all-targets --no-default-features -- -D warnings
step "clippy (with the python feature)"
cargo clippy --all-targets --features python -- -D warnings

step "cargo test (core, no Python)"
cargo test --no-default-features

step "cargo doc (no warnings allowed)"
RUSTDOCFLAGS="-D warnings" cargo doc --no-deps --no-default-features

step "the core's dependency tree has no Python"
if cargo tree --no-default-features -e normal,build --prefix none | grep -E '^(pyo3|numpy)[ -]'; then
  echo "FAIL: pyo3/numpy found in the no-default-features dependency tree" >&2
  exit 1
fi
echo "ok: no pyo3/numpy without the python feature"

step "fresh virtual environment and pip install ."
python3 -m venv --clear "$VENV"
# shellcheck disable=SC1091
. "$VENV/bin/activate"
python -m pip install -q --upgrade pip
python -m pip install -q -r requirements-dev.txt
python -m pip install -q .
python -c "import stocktank, sys; print('stocktank', stocktank.__version__, 'on Python', sys.version.split()[0])"

step "pytest"
# Run from outside the source tree so the installed package (not python/) is imported.
(cd tests/python && python -m pytest -q -p no:cacheprovider .)

step "mypy.stubtest on the hand-written stubs"
python -m mypy.stubtest stocktank._core --allowlist .ci/stubtest-allowlist.txt

step "demo notebooks, executed headless"
python scripts/run_notebooks.py notebooks-demo

step "main job (stocktank demo) runs"
tmp_out="$(mktemp -d)"
stocktank demo --out "$tmp_out" >/dev/null
ls "$tmp_out"
rm -rf "$tmp_out"

echo
echo "ALL CHECKS PASSED"
