"""The HTML scanner the site tests rely on: it must flag what it is there to flag."""

from tests.fixtures.site_kit import HtmlScan


def test_scanner_flags_script_and_network_loads():
    scan = HtmlScan()
    scan.feed('<img src="https://x.example/p.png"><a href="javascript:alert(1)">x</a><p onclick="x">y</p><script>alert(1)</script>')
    assert len(scan.findings) == 4


def test_scanner_passes_plain_markup():
    scan = HtmlScan()
    scan.feed('<p>&lt;script&gt;alert(1)&lt;/script&gt; <a href="https://example.org/">ok</a> <img src="figures/a.svg"></p>')
    assert scan.findings == []
