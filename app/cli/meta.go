package cli

// The commands Run handles itself: open (the window), help and version.
func init() {
	register(&Spec{
		Name: "open", Order: 10,
		Synopsis: "FILE.json", Summary: "open the window on a project",
		About: "Open the window on a project file. \"propflight FILE.json\" does the same,\n" +
			"and \"propflight\" alone opens the window on the demo.",
		Operand: "FILE", OperandRequired: true, MissingOperand: "give the project file to open",
	})
	register(&Spec{
		Name: "version", Order: 990,
		Summary: "print the version",
		About:   "Print the version, the Go release and the platform (the same as propflight --version).",
	})
	register(&Spec{
		Name: "help", Order: 1000,
		Synopsis: "[COMMAND]", Summary: "show the overview, or one command's flags",
		About: "Show the overview of every command, or with COMMAND that command's page:\n" +
			"its flags with their defaults (the same as propflight COMMAND --help).",
	})
}
