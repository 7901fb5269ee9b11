using Foldwise.Cli;
using Spectre.Console.Cli;

var app = new CommandApp();
app.Configure(FoldwiseApp.Configure);
return await app.RunAsync(args);
