"""Reading calculator outcomes in tests."""


def result_value(outcome, name):
    """The SI value of result ``name``; fails the test with the outcome's errors if there are any."""
    assert outcome["errors"] == {}, outcome["errors"]
    return outcome["results"][name]["value"]


def in_field_words(text, module):
    """A core note as a calculator page shows it: a leading field name ("size: …", the wording of the
    command line's options) becomes that field's label from the calculator module's FIELD_INFO
    ("Cross-section: …"), what templates/static/calc-form.js does for the form's visible fields."""
    name, sep, rest = text.partition(": ")
    if sep and name in module.FIELD_INFO:
        return module.FIELD_INFO[name][0] + sep + rest
    return text
