"""Input comparison of ``calcreport diff``: unit-equivalent values, matching by id, added/removed tables.

Unit facts used (exact by definition): 1 ft = 12 in and 1 in = 25.4 mm (NIST SP 811, 2008 ed.,
Appendix B.8: foot = 0.3048 m, inch = 0.0254 m exactly); 1 kip = 1000 lbf and 1 ksi = 1000 psi
(NIST SP 811, Appendix B.8, "kip" and "kip per square inch"); the SI prefix kilo = 10³ and
giga = 10⁹ (NIST SP 811, Table 5).
"""

from __future__ import annotations

import pytest

from calcreport.review.diff import diff_inputs, input_quantity, same_input


@pytest.mark.parametrize(
    "old,new",
    [
        ("12 in", "1 ft"),  # NIST SP 811 App. B.8
        ("1600 ksi", "1.6e6 psi"),  # NIST SP 811 App. B.8 (ksi = 1000 psi)
        ("3.6 kip", "3600 lbf"),  # NIST SP 811 App. B.8 (kip = 1000 lbf)
        ("15/32 in", "0.46875 in"),  # 15 ÷ 32 = 0.46875, arithmetic
        ("1-1/2 in", "38.1 mm"),  # 1.5 × 25.4 mm, NIST SP 811 App. B.8
        ("250 plf", "0.25 klf"),  # plf = lbf/ft, klf = kip/ft; kip = 1000 lbf
        (0.5, 0.50),
        (2, 2.0),
        ("top", "top"),
        (["top", "bot"], ["top", "bot"]),
    ],
)
def test_unit_equivalent_values_are_the_same_input(old, new):
    assert same_input(old, new)
    assert same_input(new, old)


@pytest.mark.parametrize(
    "old,new",
    [
        ("3.6 kip", "4.2 kip"),
        ("10 in", "10 mm"),  # different lengths
        ("10 in", "10 lbf"),  # different dimensions
        ("2026-11-24", "2026-12-23"),  # dates: text, although pint would read both as 1991
        ("B", "C"),
        (["top"], ["top", "bot"]),
        (True, False),
        (1, True),  # a number is not a boolean
        ("12 in", None),
    ],
)
def test_real_edits_are_changes(old, new):
    assert not same_input(old, new)


def test_text_is_not_read_as_a_quantity():
    assert input_quantity("Douglas Fir-Larch No. 2") is None
    assert input_quantity("2026-11-24") is None
    assert input_quantity("2x6") is None
    assert input_quantity("Door widened to 14 ft; shear revised") is None
    assert input_quantity("5.5 in") is not None


def _doc(parts, joints=()):
    return {"member": [{"id": "M", "part": list(parts), "joint": list(joints)}]}


def test_tables_are_matched_by_id_not_position():
    a = _doc([{"id": "web", "depth": "18 in"}, {"id": "top", "depth": "1.5 in"}])
    b = _doc(
        [{"id": "top", "depth": "1.5 in"}, {"id": "web", "depth": "1.5 ft"}]
    )  # reordered; 18 in = 1.5 ft
    changes, added, removed = diff_inputs(a, b)
    assert (changes, added, removed) == ([], [], [])


def test_changed_leaf_has_the_error_message_key_path():
    a = _doc(
        [{"id": "web", "depth": "18 in"}], [{"id": "top", "per_row": 2, "connector": {"value": "118 lbf"}}]
    )
    b = _doc(
        [{"id": "web", "depth": "20 in"}], [{"id": "top", "per_row": 3, "connector": {"value": "0.118 kip"}}]
    )
    changes, _, _ = diff_inputs(a, b)
    assert [(c.key, c.old, c.new) for c in changes] == [
        ("member[M].part[web].depth", "18 in", "20 in"),
        ("member[M].joint[top].per_row", 2, 3),
    ]


def test_added_and_removed_parts_and_joints_by_id():
    a = _doc([{"id": "web"}, {"id": "top"}], [{"id": "j1"}])
    b = _doc([{"id": "web"}, {"id": "cap"}], [{"id": "j1"}, {"id": "j2"}])
    changes, added, removed = diff_inputs(a, b)
    assert changes == []
    assert [(e.kind, e.id, e.key) for e in added] == [
        ("part", "cap", "member[M].part[cap]"),
        ("joint", "j2", "member[M].joint[j2]"),
    ]
    assert [(e.kind, e.id, e.key) for e in removed] == [("part", "top", "member[M].part[top]")]


def test_renamed_member_is_one_removed_and_one_added():
    a = {"member": [{"id": "H1", "shear": "1 kip"}]}
    b = {"member": [{"id": "H2", "shear": "1 kip"}]}
    changes, added, removed = diff_inputs(a, b)
    assert (
        changes == []
        and [e.key for e in added] == ["member[H2]"]
        and [e.key for e in removed] == ["member[H1]"]
    )


def test_tables_without_ids_fall_back_to_position():
    a = {"member": [{"id": "M", "load": [{"case": "D", "w": "100 plf"}, {"case": "L", "w": "200 plf"}]}]}
    b = {
        "member": [
            {
                "id": "M",
                "load": [
                    {"case": "D", "w": "0.1 klf"},
                    {"case": "L", "w": "250 plf"},
                    {"case": "S", "w": "50 plf"},
                ],
            }
        ]
    }
    changes, added, removed = diff_inputs(a, b)
    assert [(c.key, c.old, c.new) for c in changes] == [("member[M].load[2].w", "200 plf", "250 plf")]
    assert [(e.kind, e.key) for e in added] == [("load", "member[M].load[3]")]
    assert removed == []


def test_added_and_removed_plain_keys_and_subtables():
    a = {"settings": {"units": "US"}}
    b = {"settings": {"units": "US", "spacing_max": "6 in", "display": {"force": "kip"}}}
    changes, _, _ = diff_inputs(a, b)
    assert [(c.key, c.old, c.new) for c in changes] == [
        ("settings.spacing_max", None, "6 in"),
        ("settings.display.force", None, "kip"),
    ]
    changes, _, _ = diff_inputs(b, a)
    assert [(c.key, c.old, c.new) for c in changes] == [
        ("settings.spacing_max", "6 in", None),
        ("settings.display.force", "kip", None),
    ]


def test_history_entries_are_matched_by_mark():
    a = {"job": {"history": [{"mark": "A", "description": "first"}]}}
    b = {"job": {"history": [{"mark": "A", "description": "first"}, {"mark": "B", "description": "second"}]}}
    _, added, _ = diff_inputs(a, b)
    assert [(e.kind, e.id) for e in added] == [("history", "B")]


def test_result_values_compare_quantities_arrays_and_words():
    """1 ft = 12 in (NIST SP 811, App. B.8); arrays element-wise with the same tolerance."""
    import numpy as np

    from calcreport.review.diff import same_value
    from calcreport.units import Q_

    assert same_value(Q_(1.0, "ft"), Q_(12.0, "inch"))
    assert not same_value(Q_(1.0, "ft"), Q_(12.1, "inch"))
    assert not same_value(Q_(1.0, "ft"), Q_(1.0, "lbf"))
    assert same_value(Q_(np.array([1.0, 2.0]), "ft"), Q_(np.array([12.0, 24.0]), "inch"))
    assert not same_value(Q_(np.array([1.0, 2.0]), "ft"), Q_(np.array([12.0, 25.0]), "inch"))
    assert same_value(np.array([0.5, 1.0]), np.array([0.5, 1.0]))
    assert not same_value(np.array([0.5, 1.0]), np.array([0.5]))
    assert same_value(0.9504, 0.95040004)  # within 1e-6 relative
    assert not same_value(0.9504, 0.9505)
    assert same_value("OK", "OK") and not same_value("OK", "NG")
    assert not same_value(None, Q_(1.0, "inch"))
