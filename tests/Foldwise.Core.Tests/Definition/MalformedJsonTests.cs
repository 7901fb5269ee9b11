using Foldwise.Core.Data;
using Foldwise.Core.Definition;

namespace Foldwise.Core.Tests.Definition;

public sealed class MalformedJsonTests
{
    [Fact]
    public void A_missing_comma_is_reported_at_the_next_key()
    {
        // Given a definition whose third line lacks the comma before "metric" (counted by hand: line 3, column 3)
        string json = "{\n  \"folds\": 5\n  \"metric\": \"mae\"\n}";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "m.json", "/defs"));

        // Then the position is 1-based and the reader's own 0-based suffix is gone
        Assert.StartsWith("malformed JSON: ", e.Problem);
        Assert.DoesNotContain("LineNumber", e.Problem);
        Assert.Equal((3L, 3), (e.Line, e.Column));
    }

    [Fact]
    public void An_unclosed_string_is_reported_on_its_line()
    {
        // Given a string that never closes on line 2
        string json = "{\n  \"name\": \"open\n}";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "m.json", "/defs"));

        // Then the error is on line 2 or after, never line 0
        Assert.StartsWith("malformed JSON: ", e.Problem);
        Assert.True(e.Line >= 2, $"line {e.Line}");
        Assert.True(e.Column >= 1, $"column {e.Column}");
    }

    [Fact]
    public void Text_after_the_definition_is_refused_where_it_starts()
    {
        // Given a second value after the object, at line 2 column 1
        string json = "{ \"folds\": 3 }\nx";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "m.json", "/defs"));

        // Then it points at the extra text
        Assert.Equal((2L, 1), (e.Line, e.Column));
    }

    [Theory]
    [InlineData("")]
    [InlineData("   \n ")]
    public void An_empty_definition_is_refused_at_its_start(string json)
    {
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "m.json", "/defs"));

        Assert.Equal("m.json:1:1: the file is empty; a definition is one JSON object { ... }", e.Message);
    }

    [Fact]
    public void A_definition_of_comments_only_is_refused_where_the_text_ends()
    {
        // Given only a comment, 17 characters long
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse("// only a comment", "m.json", "/defs"));

        // Then the reader's complaint is kept and placed after the comment
        Assert.StartsWith("malformed JSON: ", e.Problem);
        Assert.Equal((1L, 18), (e.Line, e.Column));
    }
}
