"""The package follows the layout table in DEVELOPERS.md: every part listed once, imports only up the flow, no circles.

The table's rows are layers in the order of the data flow. A module may import from its own row and the rows
above it. Imports are read from the source with ast, so a late import inside a function counts too.
"""

from __future__ import annotations

import ast
import re
from pathlib import Path

import pytest

from tests.fixtures.demo import ROOT

PACKAGE = ROOT / "dossier"
ROW = re.compile(r"^\| ((?:`dossier/[^`]+`(?:, )?)+) \|")


def layout_rows(text: str) -> list[list[str]]:
    """The parts named in each row of the package table, as paths relative to dossier/."""
    rows = []
    for line in text.splitlines():
        found = ROW.match(line)
        if found:
            rows.append([part.strip("`").removeprefix("dossier/").rstrip("/") for part in found[1].split(", ")])
    return rows


def part_of(module_path: Path) -> str:
    """The layer part a file belongs to: its top-level package folder, or the top-level module's file name."""
    relative = module_path.relative_to(PACKAGE)
    return relative.parts[0] if len(relative.parts) > 1 else relative.name


def module_name(path: Path) -> str:
    dotted = ".".join(path.relative_to(ROOT).with_suffix("").parts)
    return dotted.removesuffix(".__init__")


def modules() -> dict[str, Path]:
    return {module_name(path): path for path in PACKAGE.rglob("*.py")}


def imports_of(path: Path, known: dict[str, Path]) -> set[str]:
    """The dossier modules a file imports (a name imported from a package counts as the submodule when it is one)."""
    found = set()
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.ImportFrom) and node.module and node.module.split(".")[0] == "dossier":
            for alias in node.names:
                submodule = f"{node.module}.{alias.name}"
                found.add(submodule if submodule in known else node.module)
        elif isinstance(node, ast.Import):
            found.update(alias.name for alias in node.names if alias.name.split(".")[0] == "dossier")
    return found & set(known)


@pytest.fixture(scope="module")
def graph() -> dict[str, set[str]]:
    known = modules()
    return {name: imports_of(path, known) for name, path in known.items()}


@pytest.fixture(scope="module")
def layers() -> dict[str, int]:
    rows = layout_rows((ROOT / "DEVELOPERS.md").read_text(encoding="utf-8"))
    return {part: index for index, row in enumerate(rows) for part in row}


def test_the_table_is_read():
    rows = layout_rows("| `dossier/a.py`, `dossier/b/` | x |\n| `templates/` | y |\n| `dossier/c/` | z |\n")
    assert rows == [["a.py", "b"], ["c"]]


def test_every_part_of_the_package_is_in_the_table_once(layers):
    rows = layout_rows((ROOT / "DEVELOPERS.md").read_text(encoding="utf-8"))
    listed = [part for row in rows for part in row]
    assert len(listed) == len(set(listed)), "a part is listed twice"
    present = {part_of(path) for path in PACKAGE.rglob("*.py")}
    assert present - set(listed) == set(), "in the package but not in DEVELOPERS.md's layout table"
    assert set(listed) - present == set(), "in DEVELOPERS.md's layout table but not in the package"


def test_imports_only_go_up_the_flow(graph, layers):
    against = []
    for importer, imported in graph.items():
        here = layers[part_of(modules()[importer])]
        for target in imported:
            there = layers[part_of(modules()[target])]
            if there > here:
                against.append(f"{importer} imports {target}")
    assert against == []


def test_no_module_imports_itself_round_a_circle(graph):
    assert circles(graph) == []


def test_a_circle_is_found():
    assert circles({"a": {"b"}, "b": {"c"}, "c": {"a"}, "d": {"a"}}) == [["a", "b", "c"]]


def circles(graph: dict[str, set[str]]) -> list[list[str]]:
    """Strongly connected groups of more than one module (Tarjan's algorithm, iterative), each sorted."""
    index: dict[str, int] = {}
    low: dict[str, int] = {}
    on_stack: set[str] = set()
    stack: list[str] = []
    found = []
    for start in sorted(graph):
        if start in index:
            continue
        work = [(start, iter(sorted(graph.get(start, ()))))]
        index[start] = low[start] = len(index)
        stack.append(start)
        on_stack.add(start)
        while work:
            node, children = work[-1]
            child = next(children, None)
            if child is not None:
                if child not in index:
                    index[child] = low[child] = len(index)
                    stack.append(child)
                    on_stack.add(child)
                    work.append((child, iter(sorted(graph.get(child, ())))))
                elif child in on_stack:
                    low[node] = min(low[node], index[child])
                continue
            work.pop()
            if work:
                low[work[-1][0]] = min(low[work[-1][0]], low[node])
            if low[node] == index[node]:
                group = []
                while True:
                    member = stack.pop()
                    on_stack.discard(member)
                    group.append(member)
                    if member == node:
                        break
                if len(group) > 1:
                    found.append(sorted(group))
    return found


CALCS = "dossier.calcs."
SHARED = "shared"


def calc_of(module: str) -> str | None:
    """The calc package a module belongs to ('shared' for what several calcs use), or None outside dossier/calcs."""
    if not module.startswith(CALCS):
        return None
    return module.removeprefix(CALCS).split(".")[0]


def calc_crossings(graph: dict[str, set[str]]) -> list[str]:
    """Imports from one calc's package into another's: a calc may import its own modules and shared/, and shared/
    imports no calc."""
    against = []
    for importer, imported in sorted(graph.items()):
        own = calc_of(importer)
        if own is None or importer == "dossier.calcs":
            continue
        for target in sorted(imported):
            theirs = calc_of(target)
            if theirs is not None and theirs != own and theirs != SHARED and target != "dossier.calcs":
                against.append(f"{importer} imports {target}")
    return against


def test_no_calc_imports_another_calc(graph):
    assert calc_crossings(graph) == []


def test_a_calc_crossing_is_found():
    graph = {
        "dossier.calcs.stress.voltages": {"dossier.calcs.magnetics.voltages", "dossier.calcs.shared.margins", "dossier.units"},
        "dossier.calcs.shared.rail_rise": {"dossier.calcs.magnetics.figures"},
        "dossier.calcs.rails.supply": {"dossier.calcs.rails.words"},
        "dossier.review": {"dossier.calcs.stress"},
    }
    assert calc_crossings(graph) == [
        "dossier.calcs.shared.rail_rise imports dossier.calcs.magnetics.figures",
        "dossier.calcs.stress.voltages imports dossier.calcs.magnetics.voltages",
    ]
