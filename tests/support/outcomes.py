"""Reading calculator outcomes in tests."""


def result_value(outcome, name):
    """The SI value of result ``name``; fails the test with the outcome's errors if there are any."""
    assert outcome["errors"] == {}, outcome["errors"]
    return outcome["results"][name]["value"]
