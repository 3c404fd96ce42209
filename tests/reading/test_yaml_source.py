"""YAML is read safely, positions are kept, and hostile files are refused with a located problem."""

from __future__ import annotations

import pytest

from dossier.reading import yaml_source as source
from dossier.problems import InputError
from dossier.reading.yaml_source import read_document
from tests.fixtures.bad_input import tried


def problem_of(path):
    tried("hostile or broken files (encodings, size, nesting, tags, aliases, control characters, missing)")
    with pytest.raises(InputError) as raised:
        read_document(path, shown_as="F")
    (problem,) = raised.value.problems
    return problem


def test_positions_are_kept_for_nested_keys(tmp_path):
    path = tmp_path / "r.yaml"
    path.write_text("a:\n  b: [x, {c: 1 mm}]\n", encoding="utf-8")
    document = read_document(path, shown_as="F")
    assert str(document.sources.locate(("a", "b", 1, "c"))) == "F:2:14"
    assert str(document.sources.locate(("a", "b", 1, "c"), at_key=True)) == "F:2:11"
    assert str(document.sources.locate(("a", "missing"))) == "F:2:3"


def test_billion_laughs_is_refused_quickly(tmp_path):
    lines = ["a0: &a0 [x, x, x, x, x, x, x, x, x, x]"]
    lines += [f"a{i}: &a{i} [" + ", ".join([f"*a{i-1}"] * 10) + "]" for i in range(1, 9)]
    path = tmp_path / "laughs.yaml"
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    problem = problem_of(path)
    assert problem.code == "too_many_nodes"
    assert problem.location.line >= 1


def test_non_utf8_is_located_at_the_bad_byte(tmp_path):
    path = tmp_path / "latin1.yaml"
    path.write_bytes(b"id: x\ntitle: caf\xe9\n")
    problem = problem_of(path)
    assert (problem.code, problem.location.line, problem.location.column) == ("not_utf8", 2, 11)
    assert problem.found == "byte 0xe9"


def test_files_over_the_size_limit_are_refused(tmp_path, monkeypatch):
    monkeypatch.setattr(source, "MAX_BYTES", 100)
    path = tmp_path / "big.yaml"
    path.write_text("notes: " + "x" * 200 + "\n", encoding="utf-8")
    assert problem_of(path).code == "file_too_large"


def test_deep_nesting_is_refused(tmp_path):
    path = tmp_path / "deep.yaml"
    path.write_text("a: " + "[" * 60 + "]" * 60 + "\n", encoding="utf-8")
    assert problem_of(path).code == "too_deep"


def test_nesting_far_past_the_stack_is_refused_at_the_limit(tmp_path):
    path = tmp_path / "abyss.yaml"
    path.write_text("a: " + "[" * 100_000 + "]" * 100_000 + "\n", encoding="utf-8")
    problem = problem_of(path)
    assert (problem.code, problem.location.line, problem.location.column) == ("too_deep", 1, 3 + source.MAX_DEPTH + 1)


def test_a_file_of_too_many_plain_values_is_refused(tmp_path):
    path = tmp_path / "many.yaml"
    path.write_text("a: [" + ", ".join(["1"] * (source.MAX_NODES + 10)) + "]\n", encoding="utf-8")
    problem = problem_of(path)
    assert problem.code == "too_many_nodes" and problem.location.line == 1


def test_a_file_at_the_size_limit_is_refused_without_a_monkeypatched_limit(tmp_path):
    path = tmp_path / "huge.yaml"
    path.write_text("notes: " + "x" * source.MAX_BYTES + "\n", encoding="utf-8")
    problem = problem_of(path)
    assert problem.code == "file_too_large" and problem.found == f"{source.MAX_BYTES + 8:,} bytes"


def test_merge_keys_are_refused(tmp_path):
    path = tmp_path / "merge.yaml"
    path.write_text("base: &b {x: 1}\nother:\n  <<: *b\n", encoding="utf-8")
    problem = problem_of(path)
    assert (problem.code, problem.location.line) == ("merge_key", 3)


def test_python_tags_are_not_constructed(tmp_path):
    path = tmp_path / "tag.yaml"
    path.write_text("a: !!python/object/apply:os.system ['true']\n", encoding="utf-8")
    problem = problem_of(path)
    assert (problem.code, problem.found) == ("yaml_tag", "tag tag:yaml.org,2002:python/object/apply:os.system")


def test_missing_file_is_a_problem_not_a_traceback(tmp_path):
    assert problem_of(tmp_path / "nope.yaml").code == "file_unreadable"


def test_control_characters_are_located(tmp_path):
    path = tmp_path / "ctl.yaml"
    path.write_text("id: x\ntitle: a\x0cb\n", encoding="utf-8")
    problem = problem_of(path)
    assert (problem.code, problem.location.line, problem.location.column, problem.found) == ("control_character", 2, 9, "character U+000C")


@pytest.mark.parametrize(
    "text, expected, found",
    [
        ("a:\n\tb: 1\n", "", "character '\\t' that cannot start any token"),
        ("a: 1\n---\nb: 2\n", "", "another document"),
        ("a: [1, 2\nb: 3\n", "',' or ']'", "':'"),
    ],
)
def test_yaml_syntax_errors_read_as_expected_and_found(tmp_path, text, expected, found):
    path = tmp_path / "broken.yaml"
    path.write_text(text, encoding="utf-8")
    problem = problem_of(path)
    assert (problem.code, problem.expected, problem.found) == ("yaml_syntax", expected, found)
