"""The human review of a revision: who read its findings, what they accepted or sent back, and whether they cleared it.

A sign-off file sits beside the revision it reviews (signoff-C.yaml, signoff-C-2.yaml, ...). It is bound to the
content it saw by a digest of the record and its attachments: when either changes, the sign-off is stale and
its clearance no longer counts.
"""
