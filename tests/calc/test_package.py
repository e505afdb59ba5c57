"""How the core is put together: its layers, what loading it costs, and the names it installs."""

from __future__ import annotations

import json
import subprocess
import sys
import tomllib
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]


def _modules_after(code: str, cwd: Path) -> list[str]:
    """The top-level modules (and fieldmode.tui modules) loaded by running ``code`` in a fresh interpreter."""
    names = "{m if m.startswith('fieldmode.tui') else m.split('.')[0] for m in sys.modules}"
    probe = f"{code}\nprint(json.dumps(sorted({names})))"
    done = subprocess.run([sys.executable, "-c", "import json, sys\n" + probe], capture_output=True, text=True,
                          check=True, cwd=cwd)
    loaded: list[str] = json.loads(done.stdout)
    return loaded


def test_the_core_never_imports_the_user_interface(tmp_path: Path) -> None:
    loaded = _modules_after("from fieldmode.calc.checks import SPECS\n[s.evaluate(s.demo_texts()) for s in SPECS]",
                            tmp_path)
    assert not [m for m in loaded if m in ("textual", "plotext", "textual_plotext") or m.startswith("fieldmode.tui")]


def test_every_check_spec_loads_without_pint_or_scipy(tmp_path: Path) -> None:
    # The app draws a check's fields before it loads the unit reader: listing every check costs no pint or scipy
    loaded = _modules_after("from fieldmode.calc.checks import SPECS\nassert all(s.fields for s in SPECS)", tmp_path)
    assert "pint" not in loaded and "scipy" not in loaded


def test_the_app_module_loads_without_the_unit_reader(tmp_path: Path) -> None:
    loaded = _modules_after("import fieldmode.tui.app", tmp_path)
    assert "pint" not in loaded and "scipy" not in loaded and "plotext" not in loaded


def test_only_the_products_own_name_is_installed() -> None:
    # Common practice (no source): an installed package puts only its own top-level name into an environment
    settings = tomllib.loads((ROOT / "pyproject.toml").read_text())["tool"]["setuptools"]
    listed = set(settings["packages"])
    assert all(name.startswith("fieldmode.") for name in listed)
    assert settings["package-dir"] == {"fieldmode.calc": "calc", "fieldmode.tui": "tui"}
    folders = {"fieldmode." + ".".join(init.parent.relative_to(ROOT).parts)
               for top in ("calc", "tui") for init in (ROOT / top).rglob("__init__.py")}
    assert folders == listed
